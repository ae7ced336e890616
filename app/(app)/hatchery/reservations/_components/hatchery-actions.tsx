"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/field";
import { postJson } from "@/lib/api/client";
import type { ReservationActionName } from "@/lib/reservations/queries";
import { HandOverForm } from "./hand-over-form";

/** The hatchery's next steps on one reservation, as the server says they are allowed now. */
export function HatcheryActions({ reservationId, allowed, reserved }: { reservationId: string; allowed: ReservationActionName[]; reserved: number }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);

  async function act(action: "accept" | "decline" | "cancel") {
    const question = action === "decline" ? "Decline this reservation? The fish go back on offer." : action === "cancel" ? "Cancel this reservation? Any deposit goes back to the farmer in full." : null;
    if (question && !window.confirm(question)) return;
    setBusy(true);
    setFailure(null);
    const result = await postJson(`/api/v1/reservations/${reservationId}/actions`, { action });
    setBusy(false);
    if (result.ok) router.refresh();
    else setFailure(result.message);
  }

  if (!allowed.some((a) => ["accept", "decline", "cancel", "hand_over"].includes(a))) {
    return <p className="text-sm text-silt-700">Nothing to do on your side right now.</p>;
  }
  return (
    <div className="space-y-4">
      <FormError message={failure} />
      <div className="flex flex-wrap gap-2">
        {allowed.includes("accept") ? (
          <Button disabled={busy} onClick={() => act("accept")}>
            Accept
          </Button>
        ) : null}
        {allowed.includes("decline") ? (
          <Button variant="secondary" disabled={busy} onClick={() => act("decline")}>
            Decline
          </Button>
        ) : null}
        {allowed.includes("cancel") ? (
          <Button variant="ghost" disabled={busy} onClick={() => act("cancel")}>
            Cancel reservation
          </Button>
        ) : null}
      </div>
      {allowed.includes("hand_over") ? <HandOverForm reservationId={reservationId} reserved={reserved} onDone={() => router.refresh()} /> : null}
    </div>
  );
}
