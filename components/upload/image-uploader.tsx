"use client";
import { useEffect, useId, useRef, useState } from "react";
import { putWithProgress } from "@/components/upload/put-with-progress";
import { ResponsiveImage } from "@/components/upload/responsive-image";
import { Button } from "@/components/ui/button";
import { postJson } from "@/lib/api/client";
import type { PresignedUpload, ProcessedUpload } from "@/lib/storage/upload-contract";
import { refusalMessage } from "@/lib/storage/upload-errors";
import { acceptAttribute, formatBytes, isAllowedImageType, UPLOAD_KINDS, type UploadKind } from "@/lib/storage/upload-kinds";

// Two at a time: on a slow mobile link, ten parallel uploads all finish late instead of some early.
const MAX_PARALLEL = 2;

type Status = "queued" | "uploading" | "processing" | "done" | "failed";
type Item = { key: string; file: File; status: Status; progress: number; error?: string; retryable?: boolean; image?: ProcessedUpload };

export type ImageUploaderProps = {
  kind: UploadKind;
  /** POST {kind, contentType, contentLength, ...context} → PresignedUpload */
  presignUrl: string;
  /** POST {kind, uploadId, ...context} → ProcessedUpload */
  completeUrl: string;
  /** Sent with both requests, e.g. { jobId } to name the owner object. */
  context?: Record<string, string>;
  /** Images the owner object held when this uploader appeared (not counting its own uploads since). */
  existingCount?: number;
  label?: string;
  onUploaded?: (image: ProcessedUpload) => void;
  /** Leave finished uploads out of the list, for a caller that shows them itself (e.g. with a Remove button). */
  hideDone?: boolean;
};

const EXTENSION_TYPES: Record<string, string> = { jpg: "image/jpeg", jpeg: "image/jpeg", png: "image/png", webp: "image/webp" };

/** Some pickers give no type, or the unregistered "image/jpg"; the server checks the bytes anyway. */
function declaredType(file: File): string {
  if (file.type === "image/jpg") return "image/jpeg";
  return file.type || EXTENSION_TYPES[file.name.split(".").pop()?.toLowerCase() ?? ""] || "";
}

// Network trouble, server trouble, an expired link or rate limiting are worth retrying; a refusal of the file is not.
const retryable = (status: number) => status === 0 || status === 404 || status === 408 || status === 429 || status >= 500;

export function ImageUploader({ kind, presignUrl, completeUrl, context, existingCount = 0, label, onUploaded, hideDone = false }: ImageUploaderProps) {
  const spec = UPLOAD_KINDS[kind];
  const inputId = useId();
  const [items, setItems] = useState<Item[]>([]);
  const [announcement, setAnnouncement] = useState("");
  const [notice, setNotice] = useState<string | null>(null);
  const started = useRef(new Set<string>());
  const controllers = useRef(new Map<string, AbortController>());
  const nextKey = useRef(0); // not crypto.randomUUID: it is missing outside secure contexts (a phone on the LAN)
  const latest = useRef({ presignUrl, completeUrl, context, onUploaded });
  useEffect(() => {
    latest.current = { presignUrl, completeUrl, context, onUploaded };
  });

  const update = (key: string, patch: Partial<Item>) => setItems((all) => all.map((i) => (i.key === key ? { ...i, ...patch } : i)));
  const fail = (item: Item, error: string, canRetry: boolean) => {
    update(item.key, { status: "failed", error, retryable: canRetry });
    setAnnouncement(`${item.file.name} was not uploaded: ${error}`);
  };

  async function run(item: Item, signal: AbortSignal) {
    const { presignUrl: presignAt, completeUrl: completeAt, context: extra } = latest.current;
    const presign = await postJson<PresignedUpload>(presignAt, { kind, contentType: declaredType(item.file), contentLength: item.file.size, ...extra });
    if (!presign.ok) return fail(item, presign.message, retryable(presign.status));
    const put = await putWithProgress(presign.data, item.file, (progress) => update(item.key, { progress }), signal);
    if (!put.ok) return put.aborted ? undefined : fail(item, put.message, true);
    update(item.key, { status: "processing", progress: 1 });
    setAnnouncement(`${item.file.name} is uploaded and being checked.`);
    const done = await postJson<ProcessedUpload>(completeAt, { kind, uploadId: presign.data.uploadId, ...extra });
    if (!done.ok) return fail(item, done.message, retryable(done.status));
    update(item.key, { status: "done", image: done.data });
    setAnnouncement(`${item.file.name} is ready.`);
    latest.current.onUploaded?.(done.data);
  }

  // Start queued files while fewer than MAX_PARALLEL are in flight.
  useEffect(() => {
    let active = items.filter((i) => i.status === "uploading" || i.status === "processing").length;
    for (const item of items) {
      if (active >= MAX_PARALLEL) break;
      if (item.status !== "queued" || started.current.has(item.key)) continue;
      started.current.add(item.key);
      active++;
      const controller = new AbortController();
      controllers.current.set(item.key, controller);
      update(item.key, { status: "uploading", progress: 0 });
      run(item, controller.signal)
        .catch((error: unknown) => {
          console.error("[upload] unexpected failure", error);
          fail(item, "Something went wrong on our side. Try again.", true);
        })
        .finally(() => controllers.current.delete(item.key));
    }
  });

  useEffect(() => {
    const inFlight = controllers.current;
    return () => inFlight.forEach((c) => c.abort());
  }, []);

  function addFiles(files: FileList | null) {
    if (!files) return;
    const room = spec.maxCount - existingCount - items.filter((i) => i.status !== "failed").length;
    const chosen = Array.from(files);
    setNotice(chosen.length > room ? refusalMessage("too-many-files", spec) : null);
    const added = chosen.slice(0, Math.max(0, room)).map((file): Item => {
      const key = `upload-${++nextKey.current}`;
      const early =
        file.size === 0 ? "empty" : file.size > spec.maxBytes ? "too-large" : !isAllowedImageType(spec, declaredType(file)) ? "type-not-allowed" : null;
      return early ? { key, file, status: "failed", progress: 0, error: refusalMessage(early, spec), retryable: false } : { key, file, status: "queued", progress: 0 };
    });
    setItems((all) => [...all, ...added]);
  }

  function retry(item: Item) {
    started.current.delete(item.key);
    update(item.key, { status: "queued", progress: 0, error: undefined });
  }

  function remove(item: Item) {
    controllers.current.get(item.key)?.abort();
    setItems((all) => all.filter((i) => i.key !== item.key));
  }

  return (
    <div className="space-y-3">
      <div className="space-y-1.5">
        <label htmlFor={inputId} className="block text-sm font-medium text-silt-800">
          {label ?? (spec.maxCount === 1 ? `Choose a ${spec.label}` : `Add ${spec.label}s`)}
        </label>
        <input
          id={inputId}
          type="file"
          multiple={spec.maxCount > 1}
          accept={acceptAttribute(spec)}
          aria-describedby={`${inputId}-hint`}
          onChange={(event) => {
            addFiles(event.currentTarget.files);
            event.currentTarget.value = ""; // lets the same file be chosen again after a failure
          }}
          className="block w-full text-sm text-silt-700 file:mr-3 file:min-h-11 file:cursor-pointer file:rounded-lg file:border-0 file:bg-lagoon-600 file:px-4 file:py-2.5 file:font-semibold file:text-white hover:file:bg-lagoon-700 focus-visible:outline-2 focus-visible:outline-lagoon-500"
        />
        <p id={`${inputId}-hint`} className="text-xs text-silt-600">
          JPEG, PNG or WebP, up to {formatBytes(spec.maxBytes)} each, at most {spec.maxCount} per {spec.ownerObject}. Location and camera details are removed.
        </p>
      </div>
      {notice ? (
        <p role="alert" className="text-sm font-medium text-clay-600">
          {notice}
        </p>
      ) : null}
      <p aria-live="polite" className="sr-only">
        {announcement}
      </p>
      {items.some((i) => !hideDone || i.status !== "done") ? (
        <ul className="space-y-2">
          {items.filter((i) => !hideDone || i.status !== "done").map((item) => (
            <UploadRow key={item.key} item={item} onRetry={() => retry(item)} onRemove={() => remove(item)} />
          ))}
        </ul>
      ) : null}
    </div>
  );
}

const STATUS_TEXT: Record<Status, string> = { queued: "Waiting", uploading: "Uploading", processing: "Checking", done: "Ready", failed: "Not uploaded" };

function UploadRow({ item, onRetry, onRemove }: { item: Item; onRetry: () => void; onRemove: () => void }) {
  const percent = Math.round(item.progress * 100);
  return (
    <li className="flex items-center gap-3 rounded-lg border border-silt-200 bg-white p-2.5">
      {item.image ? (
        <ResponsiveImage id={item.image.imageId} widths={item.image.widths} width={item.image.width} height={item.image.height} alt="" sizes="64px" className="h-16 w-16 rounded object-cover" />
      ) : null}
      <div className="min-w-0 flex-1 space-y-1">
        <p className="truncate text-sm font-medium text-silt-900">{item.file.name}</p>
        {item.status === "uploading" || item.status === "processing" ? (
          <div className="flex items-center gap-2">
            <progress max={100} value={item.status === "processing" ? undefined : percent} aria-label={`Upload of ${item.file.name}`} className="h-2 w-full accent-lagoon-600" />
            <span className="w-20 text-right text-xs text-silt-600">{item.status === "processing" ? "Checking…" : `${percent} %`}</span>
          </div>
        ) : (
          <p className={`text-xs ${item.status === "failed" ? "font-medium text-clay-600" : "text-silt-600"}`}>{item.error ?? STATUS_TEXT[item.status]}</p>
        )}
      </div>
      {item.status === "failed" && item.retryable ? (
        <Button type="button" variant="secondary" onClick={onRetry}>
          Retry<span className="sr-only"> {item.file.name}</span>
        </Button>
      ) : null}
      {item.status !== "done" && item.status !== "processing" ? (
        <Button type="button" variant="ghost" onClick={onRemove}>
          {item.status === "failed" ? "Dismiss" : "Cancel"}
          <span className="sr-only"> {item.file.name}</span>
        </Button>
      ) : null}
    </li>
  );
}
