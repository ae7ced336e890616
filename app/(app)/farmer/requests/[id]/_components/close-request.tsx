"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/field";
import { postJson } from "@/lib/api/client";

export function CloseRequest({ requestId }: { requestId: string }) {
  const router = useRouter();
  const [asking, setAsking] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function close() {
    const result = await postJson(`/api/v1/tank-requests/${requestId}/close`, {});
    if (!result.ok) return setError(result.message);
    router.refresh();
  }
  return asking ? (
    <div className="space-y-2">
      <p className="text-sm text-silt-700">Close this request? Builders who quoted are told and no more quotes come in.</p>
      <FormError message={error} />
      <div className="flex gap-2">
        <Button type="button" variant="danger" onClick={close}>
          Close it
        </Button>
        <Button type="button" variant="secondary" onClick={() => setAsking(false)}>
          Keep it open
        </Button>
      </div>
    </div>
  ) : (
    <Button type="button" variant="ghost" onClick={() => setAsking(true)}>
      Close this request
    </Button>
  );
}
