import type { ReactNode } from "react";
import { ResponsiveImage } from "@/components/upload/responsive-image";
import { TANK_TYPE_LABEL } from "@/lib/catalog";
import type { PortfolioEntry } from "@/lib/portfolio/portfolio-service";
import { describeSize, formatDay } from "@/lib/requests/format";

/** How wide a cover photo is drawn where the page does not say (HTML Standard, sizes attribute). */
const COVER_SIZES = "(min-width: 1024px) 22rem, (min-width: 640px) 45vw, 92vw";

/**
 * Finished tanks: photos, type, size, an approximate place and the date; Shoal jobs carry the mark. `coverSizes`
 * states the cover's drawn width for the page's own layout, so the browser does not fetch a wider file than it shows.
 */
export function PortfolioGrid({ items, actions, coverSizes = COVER_SIZES }: { items: readonly PortfolioEntry[]; actions?: (item: PortfolioEntry) => ReactNode; coverSizes?: string }) {
  return (
    <ul className="grid gap-4 sm:grid-cols-2" aria-label="Finished tanks">
      {items.map((item) => {
        const [cover, ...more] = item.photos;
        return (
          <li key={item.id} className="overflow-hidden rounded-card border border-silt-200 bg-white" data-testid="portfolio-item">
            {cover ? (
              <ResponsiveImage {...cover} alt={cover.alt || `${TANK_TYPE_LABEL[item.tankType]} tank near ${item.placeName}`} sizes={coverSizes} className="aspect-[3/2] w-full object-cover" />
            ) : null}
            <div className="space-y-1.5 p-3">
              <div className="flex flex-wrap items-center gap-2">
                <p className="font-semibold text-silt-950">{TANK_TYPE_LABEL[item.tankType]}</p>
                {item.throughShoal ? (
                  <span className="inline-flex items-center gap-1 rounded-full bg-lagoon-600 px-2 py-0.5 text-xs font-semibold text-white" title="Built through a job on Shoal, with the deposit held and released">
                    <svg viewBox="0 0 16 16" className="h-3 w-3" aria-hidden="true">
                      <path d="M3 8.5 6.5 12 13 4.5" fill="none" stroke="currentColor" strokeWidth="2" />
                    </svg>
                    Done through Shoal
                  </span>
                ) : null}
              </div>
              <p className="text-sm text-silt-700">{describeSize(item.size)}</p>
              <p className="text-sm text-silt-600">
                Near {item.placeName} <span className="text-xs">(place shown to about 1 km)</span> · {formatDay(item.completedOn)}
              </p>
              {item.caption ? <p className="text-sm text-silt-700">{item.caption}</p> : null}
              {more.length ? (
                <ul className="flex gap-1.5 pt-1" aria-label="More photos">
                  {more.map((p) => (
                    <li key={p.id}>
                      <ResponsiveImage {...p} alt="" sizes="64px" className="h-14 w-14 rounded object-cover" />
                    </li>
                  ))}
                </ul>
              ) : null}
              {actions ? actions(item) : null}
            </div>
          </li>
        );
      })}
    </ul>
  );
}
