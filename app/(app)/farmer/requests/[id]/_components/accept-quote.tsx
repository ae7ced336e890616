"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/field";
import { useConfirmStep } from "@/components/ui/use-confirm-step";
import { postJson } from "@/lib/api/client";

/** Accept, with one confirming step: the other builders are told and the deposit is asked for next. */
export function AcceptQuote({ quoteId, version, builderName, deposit }: { quoteId: string; version: number; builderName: string; deposit: string }) {
  const router = useRouter();
  const step = useConfirmStep();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function accept() {
    setBusy(true);
    setError(null);
    const result = await postJson<{ jobId: string }>(`/api/v1/quotes/${quoteId}/accept`, { version });
    setBusy(false);
    if (!result.ok) return setError(result.message);
    router.refresh();
  }

  if (!step.asking) {
    return (
      <Button ref={step.triggerRef} type="button" className="w-full" onClick={step.ask}>
        Accept {builderName}&apos;s quote
      </Button>
    );
  }
  return (
    <div className="space-y-2 rounded-lg border border-lagoon-200 bg-lagoon-50 p-3" role="group" aria-label={`Accept ${builderName}'s quote`} onKeyDown={step.onKeyDown}>
      <p className="text-sm text-lagoon-900">
        Accept this quote? The other builders are told, and you then pay a deposit of {deposit}, which Shoal holds until you confirm the finished tank.
      </p>
      <FormError message={error} />
      <div className="flex flex-wrap gap-2">
        <Button ref={step.confirmRef} type="button" onClick={accept} disabled={busy}>
          {busy ? "Accepting…" : "Yes, accept"}
        </Button>
        <Button type="button" variant="secondary" onClick={step.cancel} disabled={busy}>
          Not yet
        </Button>
      </div>
    </div>
  );
}
