"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { postJson } from "@/lib/api/client";

export function VerificationButtons({ providerId, name }: { providerId: string; name: string }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function decide(decision: "verified" | "rejected") {
    setBusy(true);
    setError(null);
    const result = await postJson(`/api/v1/admin/providers/${providerId}/verification`, { decision });
    setBusy(false);
    if (!result.ok) {
      setError(result.message);
      return;
    }
    router.refresh();
  }

  return (
    <div className="flex flex-col items-stretch gap-1 sm:items-end">
      <div className="flex gap-2">
        <Button type="button" disabled={busy} onClick={() => decide("verified")} aria-label={`Mark ${name} as checked`}>
          Mark checked
        </Button>
        <Button type="button" variant="secondary" disabled={busy} onClick={() => decide("rejected")} aria-label={`Refuse ${name}`}>
          Refuse
        </Button>
      </div>
      {error ? (
        <p role="alert" className="text-sm text-clay-600">
          {error}
        </p>
      ) : null}
    </div>
  );
}
