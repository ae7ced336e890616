import { PortfolioGrid } from "@/components/jobs/portfolio-grid";
import { Card } from "@/components/ui/card";
import { listPortfolio } from "@/lib/portfolio/portfolio-service";

/** The builder's portfolio on the public page. Places were rounded to about 1 km when stored. */
export async function FinishedTanks({ providerId }: { providerId: string }) {
  const items = await listPortfolio(providerId);
  const throughShoal = items.filter((i) => i.throughShoal).length;
  return (
    <Card>
      <h2 id="finished-tanks" className="scroll-mt-20 text-lg font-semibold">
        Finished tanks
      </h2>
      {items.length ? (
        <>
          <p className="mb-3 mt-1 text-sm text-silt-600">
            {items.length} {items.length === 1 ? "tank" : "tanks"}
            {throughShoal ? `, ${throughShoal} done through Shoal with the deposit held until the farmer confirmed` : ""}.
          </p>
          <PortfolioGrid items={items} />
        </>
      ) : (
        <p className="mt-1 text-sm text-silt-600">No finished tanks shown yet.</p>
      )}
    </Card>
  );
}
