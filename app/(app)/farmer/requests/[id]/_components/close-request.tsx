"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/field";
import { useConfirmStep } from "@/components/ui/use-confirm-step";
import { postJson } from "@/lib/api/client";

export function CloseRequest({ requestId }: { requestId: string }) {
  const router = useRouter();
  const step = useConfirmStep();
  const [error, setError] = useState<string | null>(null);
  async function close() {
    const result = await postJson(`/api/v1/tank-requests/${requestId}/close`, {});
    if (!result.ok) return setError(result.message);
    router.refresh();
  }
  return step.asking ? (
    <div className="space-y-2" role="group" aria-label="Close this request" onKeyDown={step.onKeyDown}>
      <p className="text-sm text-silt-700">Close this request? Builders who quoted are told and no more quotes come in.</p>
      <FormError message={error} />
      <div className="flex gap-2">
        <Button ref={step.confirmRef} type="button" variant="danger" onClick={close}>
          Close it
        </Button>
        <Button type="button" variant="secondary" onClick={step.cancel}>
          Keep it open
        </Button>
      </div>
    </div>
  ) : (
    <Button ref={step.triggerRef} type="button" variant="ghost" onClick={step.ask}>
      Close this request
    </Button>
  );
}
