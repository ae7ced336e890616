"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/field";
import { postJson } from "@/lib/api/client";

export function CancelReservationButton({ reservationId }: { reservationId: string }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  async function cancel() {
    if (!window.confirm("Cancel this reservation? The fish go back on offer and any deposit comes back to you in full.")) return;
    setBusy(true);
    const result = await postJson(`/api/v1/reservations/${reservationId}/actions`, { action: "cancel" });
    setBusy(false);
    if (result.ok) router.refresh();
    else setFailure(result.message);
  }
  return (
    <div className="space-y-2">
      <FormError message={failure} />
      <Button variant="ghost" disabled={busy} onClick={cancel}>
        Cancel reservation
      </Button>
    </div>
  );
}
