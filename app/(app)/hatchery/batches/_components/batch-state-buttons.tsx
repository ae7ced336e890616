"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { postJson } from "@/lib/api/client";
import type { BatchState } from "@/lib/catalog";

/** Pause, resume or close a batch; reservations already made carry on either way. */
export function BatchStateButtons({ batchId, state, label }: { batchId: string; state: BatchState; label: string }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  if (state === "closed") return null;

  async function act(action: "pause" | "resume" | "close") {
    if (action === "close" && !window.confirm(`Close the ${label} batch for good? Reservations already made carry on.`)) return;
    setBusy(true);
    setError(null);
    const result = await postJson(`/api/v1/batches/${batchId}/state`, { action });
    setBusy(false);
    if (result.ok) router.refresh();
    else setError(result.message);
  }

  return (
    <div className="flex flex-wrap items-center gap-2">
      {state === "open" ? (
        <Button variant="secondary" disabled={busy} onClick={() => act("pause")} aria-label={`Pause ${label}`}>
          Pause
        </Button>
      ) : (
        <Button variant="secondary" disabled={busy} onClick={() => act("resume")} aria-label={`Resume ${label}`}>
          Resume
        </Button>
      )}
      <Button variant="ghost" disabled={busy} onClick={() => act("close")} aria-label={`Close ${label}`}>
        Close
      </Button>
      {error ? (
        <p role="alert" className="w-full text-sm font-medium text-clay-600">
          {error}
        </p>
      ) : null}
    </div>
  );
}
