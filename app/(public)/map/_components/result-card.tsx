import Link from "next/link";
import { ProviderMark } from "@/components/map/provider-marker";
import { TrustBadge } from "@/components/trust/trust-badge";
import type { NearbyItem } from "@/lib/listings/search";
import { SPECIES_LABEL, TANK_TYPE_LABEL } from "@/lib/catalog";

export function ResultCard({ item, selected, onShowOnMap }: { item: NearbyItem; selected: boolean; onShowOnMap: () => void }) {
  const offers =
    item.kind === "hatchery"
      ? item.species.map((s) => SPECIES_LABEL[s as keyof typeof SPECIES_LABEL] ?? s)
      : item.tankTypes.map((t) => TANK_TYPE_LABEL[t as keyof typeof TANK_TYPE_LABEL] ?? t);
  return (
    <li className={`rounded-card border bg-white p-4 ${selected ? "border-reed-400 ring-2 ring-reed-200" : "border-silt-200"}`} data-testid="result">
      <div className="flex gap-3">
        <ProviderMark kind={item.kind} />
        <div className="min-w-0 flex-1">
          <div className="flex items-baseline justify-between gap-2">
            <Link href={`/providers/${item.providerId}`} className="truncate font-semibold text-silt-950 underline-offset-2 hover:underline">
              {item.displayName}
            </Link>
            <span className="shrink-0 text-sm font-semibold text-lagoon-700" data-testid="result-distance">
              {item.distanceKm.toLocaleString("en", { maximumFractionDigits: 1 })} km
            </span>
          </div>
          <p className="text-sm text-silt-600">
            {item.kind === "hatchery" ? "Hatchery" : "Tank builder"} · {item.region}
          </p>
          <TrustBadge badge={item.trust} role={item.kind} className="mt-1" />
          {offers.length ? <p className="mt-1 text-sm text-silt-700">{offers.join(" · ")}</p> : null}
          <button type="button" onClick={onShowOnMap} data-show-on-map={item.listingId} className="mt-1 text-sm font-medium text-lagoon-700 underline underline-offset-2">
            Show on map
          </button>
        </div>
      </div>
    </li>
  );
}
