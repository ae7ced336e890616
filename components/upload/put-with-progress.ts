import type { PresignedUpload } from "@/lib/storage/upload-contract";

export type PutResult = { ok: true } | { ok: false; message: string; aborted: boolean };

/**
 * PUTs a file straight to storage with a presigned URL. XMLHttpRequest rather than fetch because only
 * XHR reports upload progress in every browser we support. The browser sets Content-Length from the
 * file, and the headers are the signed ones, so storage refuses anything but the declared file.
 */
export function putWithProgress(
  target: Pick<PresignedUpload, "url" | "method" | "headers">,
  file: Blob,
  onProgress: (fraction: number) => void,
  signal?: AbortSignal,
): Promise<PutResult> {
  return new Promise((resolve) => {
    const xhr = new XMLHttpRequest();
    xhr.open(target.method, target.url);
    for (const [name, value] of Object.entries(target.headers)) xhr.setRequestHeader(name, value);
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress(event.loaded / event.total);
    };
    xhr.onload = () => {
      if (xhr.status >= 200 && xhr.status < 300) return resolve({ ok: true });
      const message =
        xhr.status === 403
          ? "The upload link expired or was refused. Try again."
          : `The photo store answered ${xhr.status}. Try again in a moment.`;
      resolve({ ok: false, message, aborted: false });
    };
    xhr.onerror = () => resolve({ ok: false, message: "The upload was interrupted. Check your connection and try again.", aborted: false });
    xhr.onabort = () => resolve({ ok: false, message: "Upload cancelled.", aborted: true });
    if (signal?.aborted) return xhr.abort();
    signal?.addEventListener("abort", () => xhr.abort(), { once: true });
    xhr.send(file);
  });
}
