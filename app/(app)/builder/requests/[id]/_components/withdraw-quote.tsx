"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/field";
import { useConfirmStep } from "@/components/ui/use-confirm-step";
import { postJson } from "@/lib/api/client";

export function WithdrawQuote({ quoteId }: { quoteId: string }) {
  const router = useRouter();
  const step = useConfirmStep();
  const [error, setError] = useState<string | null>(null);
  async function withdraw() {
    const result = await postJson(`/api/v1/quotes/${quoteId}/withdraw`, {});
    if (!result.ok) return setError(result.message);
    step.cancel();
    router.refresh();
  }
  if (!step.asking) {
    return (
      <Button ref={step.triggerRef} type="button" variant="ghost" onClick={step.ask}>
        Withdraw this quote
      </Button>
    );
  }
  return (
    <div className="space-y-2 rounded-lg border border-clay-500/30 bg-clay-50 p-3" role="group" aria-label="Withdraw this quote" onKeyDown={step.onKeyDown}>
      <p className="text-sm text-clay-700">Withdraw your quote? The farmer is told and can no longer accept it. You can send a new one while the request is open.</p>
      <FormError message={error} />
      <div className="flex gap-2">
        <Button ref={step.confirmRef} type="button" variant="danger" onClick={withdraw}>
          Withdraw
        </Button>
        <Button type="button" variant="secondary" onClick={step.cancel}>
          Keep it
        </Button>
      </div>
    </div>
  );
}
