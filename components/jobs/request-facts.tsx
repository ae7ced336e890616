import Link from "next/link";
import { POWER_SOURCE_LABEL, SITE_READINESS_LABEL, WATER_SOURCE_LABEL } from "@/lib/jobs/vocabulary";
import { formatDay, fullVolumeM3 } from "@/lib/requests/format";
import type { RequestDetail } from "@/lib/requests/request-views";

/** The facts of a tank request, as a definition list both sides read. */
export function RequestFacts({ request, place }: { request: RequestDetail; place?: string }) {
  const tonnes = fullVolumeM3(request.size); // 1 m³ of fresh water ≈ 1 tonne (common practice)
  return (
    <dl className="grid grid-cols-[9rem_1fr] gap-x-3 gap-y-1.5 text-sm">
      <dt className="text-silt-600">Tank</dt>
      <dd className="first-letter:uppercase">{request.title}</dd>
      <dt className="text-silt-600">Floor, when full</dt>
      <dd>
        {request.floorAreaM2.toFixed(1)} m² floor · about {tonnes.toFixed(1)} tonnes of water when full
      </dd>
      {place ? (
        <>
          <dt className="text-silt-600">Site</dt>
          <dd>{place}</dd>
        </>
      ) : null}
      <dt className="text-silt-600">Ground</dt>
      <dd>{SITE_READINESS_LABEL[request.readiness]}</dd>
      <dt className="text-silt-600">Water</dt>
      <dd>{WATER_SOURCE_LABEL[request.waterSource]}</dd>
      <dt className="text-silt-600">Power</dt>
      <dd>{POWER_SOURCE_LABEL[request.power]}</dd>
      <dt className="text-silt-600">Wanted by</dt>
      <dd>{formatDay(request.wantedBy)}</dd>
      {request.plan ? (
        <>
          <dt className="text-silt-600">Plan</dt>
          <dd>
            <Link href={`/plans/${request.plan.id}`} className="font-medium text-lagoon-700 underline underline-offset-2">
              {request.plan.name}
            </Link>
          </dd>
        </>
      ) : null}
      {request.notes ? (
        <>
          <dt className="text-silt-600">Notes</dt>
          <dd className="whitespace-pre-line">{request.notes}</dd>
        </>
      ) : null}
    </dl>
  );
}
