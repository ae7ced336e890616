"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field, FormError, inputClass } from "@/components/ui/field";
import { postJson } from "@/lib/api/client";

// The payment stand-in's test cards (scripts/fakes/payments-engine.ts). A live deployment puts the processor's
// own card form here; the API takes the token it returns.
const CARDS = [
  { value: "pm_card_visa", label: "Visa ending 4242" },
  { value: "pm_card_mastercard", label: "Mastercard ending 4444" },
  { value: "pm_card_chargeDeclined", label: "A card that is declined (to try)" },
];

export function DepositForm({ jobId, deposit, lastDecline }: { jobId: string; deposit: string; lastDecline: string | null }) {
  const router = useRouter();
  const [card, setCard] = useState(CARDS[0]?.value ?? "");
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(lastDecline);

  async function pay(event: React.FormEvent) {
    event.preventDefault();
    setBusy(true);
    setError(null);
    const result = await postJson(`/api/v1/jobs/${jobId}/deposit`, { paymentMethod: card });
    setBusy(false);
    if (!result.ok) return setError(result.message);
    router.refresh();
  }

  return (
    <form onSubmit={pay} className="space-y-3" aria-label="Pay the deposit">
      <p className="text-sm text-silt-700">
        Pay the deposit of <strong>{deposit}</strong>. Shoal holds it: the builder is paid only when you confirm the finished tank, and you get it back if the job is
        cancelled before work starts.
      </p>
      <FormError message={error} />
      <Field id="deposit-card" label="Card">
        <select id="deposit-card" className={inputClass} value={card} onChange={(e) => setCard(e.target.value)}>
          {CARDS.map((c) => (
            <option key={c.value} value={c.value}>
              {c.label}
            </option>
          ))}
        </select>
      </Field>
      <Button type="submit" disabled={busy}>
        {busy ? "Paying…" : `Pay ${deposit} deposit`}
      </Button>
    </form>
  );
}
