"use client";
import { useRouter } from "next/navigation";
import { useEffect, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { Field, FormError, inputClass } from "@/components/ui/field";
import { postJson } from "@/lib/api/client";
import type { JobButton } from "@/lib/jobs/job-actions";

const LABEL: Record<Exclude<JobButton, "resolve" | "dispute" | "cancel">, string> = {
  arrive: "I am on site: start the job",
  mark_built: "Mark the tank built",
  confirm: "Confirm: the tank is as agreed",
};

/** The moves this person may make on the job now (the server checks each again). */
export function JobActionsPanel({ jobId, buttons, photoHint }: { jobId: string; buttons: JobButton[]; photoHint?: string }) {
  const router = useRouter();
  const [busy, setBusy] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [open, setOpen] = useState<"dispute" | "cancel" | null>(null);
  const [reason, setReason] = useState("");
  // The reason box opens below its button: focus goes into it, and Escape closes it and returns to that button.
  const reasonRef = useRef<HTMLTextAreaElement>(null);
  const toggles = { dispute: useRef<HTMLButtonElement>(null), cancel: useRef<HTMLButtonElement>(null) };
  useEffect(() => {
    if (open) reasonRef.current?.focus();
  }, [open]);
  function closeReason() {
    const was = open;
    setOpen(null);
    if (was) toggles[was].current?.focus();
  }

  async function act(body: Record<string, string>) {
    setBusy(body.type ?? null);
    setError(null);
    const result = await postJson(`/api/v1/jobs/${jobId}/events`, body);
    setBusy(null);
    if (!result.ok) return setError(result.message);
    setOpen(null);
    setReason("");
    router.refresh();
  }

  const simple = buttons.filter((b): b is keyof typeof LABEL => b in LABEL);
  if (buttons.length === 0) return null;
  return (
    <div className="space-y-3">
      <FormError message={error} />
      <div className="flex flex-wrap gap-2">
        {simple.map((b) => (
          <Button key={b} type="button" onClick={() => act({ type: b })} disabled={busy !== null}>
            {busy === b ? "Saving…" : LABEL[b]}
          </Button>
        ))}
        {buttons.includes("dispute") ? (
          <Button ref={toggles.dispute} type="button" variant="secondary" onClick={() => setOpen(open === "dispute" ? null : "dispute")} aria-expanded={open === "dispute"} aria-controls="job-reason-form">
            Something is wrong: open a dispute
          </Button>
        ) : null}
        {buttons.includes("cancel") ? (
          <Button ref={toggles.cancel} type="button" variant="ghost" onClick={() => setOpen(open === "cancel" ? null : "cancel")} aria-expanded={open === "cancel"} aria-controls="job-reason-form">
            Cancel the job
          </Button>
        ) : null}
      </div>
      {simple.includes("mark_built") && photoHint ? <p className="text-xs text-silt-600">{photoHint}</p> : null}
      {open ? (
        <form
          id="job-reason-form"
          className="space-y-2 rounded-lg border border-silt-200 bg-silt-50 p-3"
          onKeyDown={(e) => {
            if (e.key === "Escape") {
              e.preventDefault();
              closeReason();
            }
          }}
          onSubmit={(e) => {
            e.preventDefault();
            void act({ type: open, reason });
          }}
        >
          <Field id="job-reason" label={open === "dispute" ? "What is wrong? Shoal reads this before deciding." : "Why cancel? (optional)"}>
            <textarea ref={reasonRef} id="job-reason" rows={3} className={inputClass} value={reason} onChange={(e) => setReason(e.target.value)} />
          </Field>
          <p className="text-xs text-silt-600">
            {open === "dispute"
              ? "The deposit stays held and no one can move it until an admin has looked at the job with you both."
              : "Before work starts a held deposit goes back to the farmer in full."}
          </p>
          <Button type="submit" variant="danger" disabled={busy !== null}>
            {busy === open ? "Sending…" : open === "dispute" ? "Open the dispute" : "Cancel the job"}
          </Button>
        </form>
      ) : null}
    </div>
  );
}
