import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { TrustBadge } from "@/components/trust/trust-badge";
import { Card } from "@/components/ui/card";
import { ResponsiveImage } from "@/components/upload/responsive-image";
import { getCurrentUser } from "@/lib/auth/session";
import { SPECIES_LABEL, TANK_TYPE_LABEL } from "@/lib/catalog";
import { env } from "@/lib/env";
import { getPublicProvider } from "@/lib/listings/provider";
import { formatMoney } from "@/lib/money/money";
import { feetToMetres } from "@/lib/planner/units";
import { parseReviewFilters, type SearchParamsRecord } from "@/lib/reviews/review-filters";
import type { ReviewRole } from "@/lib/reviews/types";
import { getProviderTrust } from "@/lib/trust/provider-trust";
import { FinishedTanks } from "./_components/finished-tanks";
import { ProviderReviews } from "./_components/provider-reviews";
import { ProviderTrust } from "./_components/provider-trust";
import { ServiceArea } from "./_components/service-area";

type Props = { params: Promise<{ id: string }>; searchParams: Promise<SearchParamsRecord> };

const ROLE_LABEL: Record<ReviewRole, string> = { builder: "Tank builder", hatchery: "Hatchery" };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const provider = await getPublicProvider((await params).id);
  return { title: provider ? provider.displayName : "Provider not found" };
}

// A common small tank: 6 ft × 10 ft (common practice), used for a starting price.
const COMMON_TANK_FLOOR_M2 = feetToMetres(6) * feetToMetres(10);

function dateOnly(iso: string): string {
  return new Date(iso).toLocaleDateString("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });
}

/** Reserving is for signed-in farmers; a visitor is sent to sign in and comes back to the form. */
function ReserveLink({ batchId, available, viewer, providerId }: { batchId: string; available: number; viewer: { id: string; farmer: boolean } | null; providerId: string }) {
  if (available < 1 || viewer?.id === providerId) return null;
  const form = `/farmer/reservations/new?batch=${batchId}`;
  if (viewer && !viewer.farmer) return null;
  return (
    <Link href={viewer ? form : `/sign-in?next=${encodeURIComponent(form)}`} className="inline-flex min-h-11 items-center justify-center rounded-lg bg-lagoon-600 px-4 text-sm font-semibold text-white hover:bg-lagoon-700">
      {viewer ? "Reserve" : "Sign in to reserve"}
    </Link>
  );
}

export default async function ProviderPage({ params, searchParams }: Props) {
  const provider = await getPublicProvider((await params).id);
  if (!provider) notFound();
  // Builder first: most farmers come for a tank before they come for fish.
  const roles: ReviewRole[] = [provider.builder ? ("builder" as const) : null, provider.hatchery ? ("hatchery" as const) : null].filter((r) => r !== null);
  const [user, trust] = await Promise.all([getCurrentUser(), Promise.all(roles.map(async (role) => ({ role, summary: await getProviderTrust(provider.id, role) })))]);
  const viewer = user ? { id: user.id, farmer: user.roles.includes("farmer") } : null;
  const filters = parseReviewFilters(await searchParams, roles);
  const kinds = [provider.hatchery ? "Hatchery" : null, provider.builder ? "Tank builder" : null].filter(Boolean).join(" · ");
  const phoneDigits = provider.phone ?? "";
  const terms = provider.builder;

  return (
    <div className="mx-auto max-w-5xl px-4 py-8">
      <header className="flex flex-wrap items-center gap-4">
        {provider.avatar ? (
          <ResponsiveImage {...provider.avatar} sizes="80px" loading="eager" className="h-20 w-20 rounded-2xl object-cover" />
        ) : (
          <span className="h-20 w-20 rounded-2xl bg-lagoon-100" aria-hidden="true" />
        )}
        <div className="min-w-0 flex-1">
          <h1 className="text-2xl font-semibold text-silt-950 sm:text-3xl">{provider.displayName}</h1>
          <p className="text-silt-700">
            {kinds} · {provider.region}
          </p>
          <p className="mt-1">
            {provider.verified ? (
              <span className="rounded-full bg-lagoon-100 px-2.5 py-1 text-sm font-medium text-lagoon-800">Checked by Shoal</span>
            ) : (
              <span className="rounded-full bg-silt-200 px-2.5 py-1 text-sm font-medium text-silt-700">Not checked yet</span>
            )}
          </p>
          <div className="mt-2 space-y-1">
            {trust.map(({ role, summary }) => (
              <a key={role} href="#trust" className="block w-fit rounded-lg hover:bg-silt-100">
                <TrustBadge
                  size="md"
                  role={role}
                  roleLabel={trust.length > 1 ? ROLE_LABEL[role] : undefined}
                  badge={{ isNew: summary.isNew, displayRating: summary.displayRating, reviews: summary.counts.reviews, jobsCompleted: summary.counts.jobsCompleted, verified: false }}
                />
              </a>
            ))}
          </div>
        </div>
        {phoneDigits ? (
          <div className="flex w-full gap-2 sm:w-auto">
            <a href={`tel:${phoneDigits}`} className="inline-flex min-h-11 flex-1 items-center justify-center rounded-lg bg-lagoon-600 px-4 text-sm font-semibold text-white hover:bg-lagoon-700 sm:flex-none">
              Call
            </a>
            <a href={`sms:${phoneDigits}`} className="inline-flex min-h-11 flex-1 items-center justify-center rounded-lg border border-silt-300 bg-white px-4 text-sm font-semibold text-silt-900 hover:bg-silt-100 sm:flex-none">
              Send a message
            </a>
          </div>
        ) : null}
      </header>

      <div className="mt-6 grid gap-4 md:grid-cols-[1fr_20rem]">
        <div className="space-y-4">
          {provider.about ? (
            <Card>
              <h2 className="text-lg font-semibold">About</h2>
              <p className="mt-1 whitespace-pre-line text-silt-700">{provider.about}</p>
            </Card>
          ) : null}

          {trust.length ? <ProviderTrust trust={trust} /> : null}

          {terms ? (
            <Card>
              <h2 className="text-lg font-semibold">Tanks and starting prices</h2>
              <p className="mt-1 text-sm text-silt-600">
                Per square metre of tank floor. A quote adds a base fee of {formatMoney(terms.baseFeeMinor, terms.currency)} and travel at{" "}
                {formatMoney(terms.travelRatePerKmMinor, terms.currency)} per km from the builder&apos;s base. Materials drop out when you supply them.
              </p>
              {terms.prices.length ? (
                <div className="mt-3 overflow-x-auto">
                  <table className="w-full text-left text-sm">
                    <thead className="text-silt-600">
                      <tr>
                        <th scope="col" className="py-2 pr-3 font-medium">Tank type</th>
                        <th scope="col" className="py-2 pr-3 font-medium">Materials / m²</th>
                        <th scope="col" className="py-2 pr-3 font-medium">Labour / m²</th>
                        <th scope="col" className="py-2 font-medium">6 × 10 ft tank from</th>
                      </tr>
                    </thead>
                    <tbody className="divide-y divide-silt-100">
                      {terms.prices.map((p) => (
                        <tr key={p.tankType}>
                          <th scope="row" className="py-2 pr-3 font-medium text-silt-900">{TANK_TYPE_LABEL[p.tankType]}</th>
                          <td className="py-2 pr-3">{formatMoney(p.materialsPerSqmMinor, terms.currency)}</td>
                          <td className="py-2 pr-3">{formatMoney(p.labourPerSqmMinor, terms.currency)}</td>
                          <td className="py-2 font-semibold">
                            {formatMoney(Math.round((p.materialsPerSqmMinor + p.labourPerSqmMinor) * COMMON_TANK_FLOOR_M2) + terms.baseFeeMinor, terms.currency)}
                          </td>
                        </tr>
                      ))}
                    </tbody>
                  </table>
                </div>
              ) : (
                <p className="mt-3 text-sm text-silt-600">No price sheet yet: ask for a quote.</p>
              )}
            </Card>
          ) : null}

          {provider.hatchery ? (
            <Card>
              <h2 className="text-lg font-semibold">Fingerlings</h2>
              <p className="mt-1 text-sm text-silt-700">
                {provider.hatchery.species.map((s) => SPECIES_LABEL[s]).join(" and ") || "Species not listed yet"} ·{" "}
                {provider.hatchery.delivers ? `delivers within ${provider.hatchery.deliveryRadiusKm} km` : "collection at the hatchery"}
              </p>
              {provider.hatchery.batches.length ? (
                <ul className="mt-3 divide-y divide-silt-100">
                  {provider.hatchery.batches.map((b) => (
                    <li key={b.id} className="flex flex-wrap items-center justify-between gap-2 py-2 text-sm">
                      <span className="min-w-0">
                        <span className="block font-medium text-silt-900">
                          {SPECIES_LABEL[b.species]}, about {b.meanWeightG} g / {b.meanLengthCm} cm
                        </span>
                        <span className="text-silt-700">
                          {b.countAvailable.toLocaleString("en")} left · {formatMoney(b.priceMinor, b.currency)} each ·{" "}
                          {b.readyNow ? "ready now" : `ready ${dateOnly(b.readyFrom)}`} · until {dateOnly(b.sellBy)}
                        </span>
                      </span>
                      <ReserveLink batchId={b.id} available={b.countAvailable} viewer={viewer} providerId={provider.id} />
                    </li>
                  ))}
                </ul>
              ) : (
                <p className="mt-3 text-sm text-silt-600">No batches on offer right now.</p>
              )}
            </Card>
          ) : null}

          {provider.builder ? <FinishedTanks providerId={provider.id} /> : null}
          {filters ? <ProviderReviews providerId={provider.id} providerName={provider.displayName} roles={roles} filters={filters} viewerId={user?.id ?? null} /> : null}
        </div>

        <aside className="space-y-3">
          {provider.point ? (
            <>
              <ServiceArea
                point={provider.point}
                radiusKm={provider.builder?.serviceRadiusKm ?? provider.hatchery?.deliveryRadiusKm ?? 0}
                kind={provider.builder ? "builder" : "hatchery"}
                hostedStyleUrl={env.MAP_STYLE_URL ?? null}
              />
              <p className="text-xs text-silt-600">
                {provider.builder ? `Works within ${provider.builder.serviceRadiusKm} km. ` : ""}
                The point is approximate (about 1 km) to protect the provider&apos;s home.
              </p>
            </>
          ) : null}
        </aside>
      </div>
    </div>
  );
}
