import { PortfolioGrid } from "@/components/jobs/portfolio-grid";
import { Card } from "@/components/ui/card";
import { listPortfolio } from "@/lib/portfolio/portfolio-service";

/**
 * A cover's drawn width on this page (max-w-5xl, px-4; a card with p-5; from md a 20rem side column; from sm two
 * photos a row): 100vw − 76 px on a phone, so a 390 px phone at 2× takes the 640 px file, not the 1280 px one.
 */
const COVER_SIZES = "(min-width: 1024px) 19rem, (min-width: 768px) calc(50vw - 13rem), (min-width: 640px) calc(50vw - 3rem), calc(100vw - 4.75rem)";

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
          <PortfolioGrid items={items} coverSizes={COVER_SIZES} />
        </>
      ) : (
        <p className="mt-1 text-sm text-silt-600">No finished tanks shown yet.</p>
      )}
    </Card>
  );
}
