"use client";
import { useRouter } from "next/navigation";
import { useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { FormError } from "@/components/ui/field";
import { postJson } from "@/lib/api/client";
import { formatMoney } from "@/lib/money/money";
import { TEST_PAYMENT_METHODS } from "@/lib/reservations/test-payment-methods";
import { AttemptKeys } from "./attempt-key";

/**
 * Pays the deposit. Against the payments stand-in the card is one of its test payment methods; a live deployment
 * would put the processor's card form here and send its token instead.
 */
export function PayForm({ reservationId, depositMinor, currency, lastDecline }: { reservationId: string; depositMinor: number; currency: string; lastDecline: string | null }) {
  const router = useRouter();
  const keys = useRef(new AttemptKeys());
  const [method, setMethod] = useState<string>(TEST_PAYMENT_METHODS[0].id);
  const [busy, setBusy] = useState(false);
  const [declined, setDeclined] = useState<string | null>(lastDecline);
  const [failure, setFailure] = useState<string | null>(null);

  async function pay(event: React.FormEvent) {
    event.preventDefault();
    setBusy(true);
    setFailure(null);
    setDeclined(null);
    const body = { paymentMethod: method };
    const result = await postJson(`/api/v1/reservations/${reservationId}/pay`, body, { idempotencyKey: keys.current.keyFor(body) });
    keys.current.settle(result);
    setBusy(false);
    if (result.ok) {
      router.refresh();
      return;
    }
    if (result.status === 402) setDeclined(result.message);
    else setFailure(result.message);
  }

  return (
    <form onSubmit={pay} className="space-y-4" noValidate>
      {declined ? (
        <div role="alert" className="rounded-lg border border-clay-500/40 bg-clay-50 px-3 py-2.5 text-sm text-clay-700">
          <strong>The card was declined.</strong> {declined} Nothing was charged. Choose another card and try again.
        </div>
      ) : null}
      <FormError message={failure} />
      <fieldset>
        <legend className="text-sm font-medium text-silt-800">Pay with</legend>
        <div className="mt-2 space-y-2">
          {TEST_PAYMENT_METHODS.map((m) => (
            <label key={m.id} className="flex min-h-11 items-center gap-3 rounded-lg border border-silt-200 px-3 text-sm has-[:checked]:border-lagoon-500 has-[:checked]:bg-lagoon-50">
              <input type="radio" name="paymentMethod" value={m.id} checked={method === m.id} onChange={() => setMethod(m.id)} className="h-5 w-5 accent-lagoon-600" />
              {m.label}
            </label>
          ))}
        </div>
        <p className="mt-2 text-xs text-silt-600">This demo pays through a local stand-in for the card processor: no real money moves.</p>
      </fieldset>
      <Button type="submit" disabled={busy}>
        {busy ? "Paying…" : `Pay ${formatMoney(depositMinor, currency)} deposit`}
      </Button>
    </form>
  );
}
