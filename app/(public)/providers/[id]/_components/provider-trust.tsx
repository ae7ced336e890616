import { TrustReasons } from "@/components/trust/trust-reasons";
import { Card } from "@/components/ui/card";
import type { ReviewRole } from "@/lib/reviews/types";
import type { TrustSummary } from "@/lib/trust/compose-trust";

const HEADING: Record<ReviewRole, string> = { builder: "as a tank builder", hatchery: "as a hatchery" };

/** One card per role the provider holds: a builder who also sells fish is judged on each separately. */
export function ProviderTrust({ trust }: { trust: readonly { role: ReviewRole; summary: TrustSummary }[] }) {
  const several = trust.length > 1;
  return (
    <Card>
      <h2 id="trust" className="scroll-mt-20 text-lg font-semibold">
        How this score is made
      </h2>
      <div className="mt-3 space-y-6" data-testid="trust-section">
        {trust.map(({ role, summary }) => {
          const headingId = `trust-${role}`;
          return (
            <section key={role} aria-labelledby={headingId} data-testid={`trust-${role}`}>
              <h3 id={headingId} className={several ? "mb-2 font-semibold text-silt-900" : "sr-only"}>
                Trust {HEADING[role]}
              </h3>
              <TrustReasons summary={summary} role={role} headingId={headingId} />
            </section>
          );
        })}
      </div>
      <p className="mt-3 text-xs text-silt-600">
        Only what happened on Shoal counts: reviews from farmers {trust.some((t) => t.role === "builder") ? "whose tank was finished" : ""}
        {trust.length > 1 ? " or " : ""}
        {trust.some((t) => t.role === "hatchery") ? "who received fish and reported how they did" : ""}, jobs and disputes as recorded, and Shoal&apos;s own checks. For
        the order on the map we take the share of happy customers we can be 95% sure of, so three five-star reviews do not outrank a long record of good ones.
      </p>
    </Card>
  );
}
