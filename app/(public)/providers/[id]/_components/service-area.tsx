"use client";
import dynamic from "next/dynamic";

const ServiceAreaMap = dynamic(() => import("@/components/map/service-area-map"), {
  ssr: false,
  loading: () => <div className="h-full w-full animate-pulse bg-lagoon-50" />,
});

export function ServiceArea(props: { point: { lat: number; lng: number }; radiusKm: number; kind: "hatchery" | "builder"; hostedStyleUrl: string | null }) {
  return (
    <div className="h-56 overflow-hidden rounded-card border border-silt-200" role="img" aria-label={`Map of the area served: ${props.radiusKm} km around an approximate point`}>
      <ServiceAreaMap {...props} />
    </div>
  );
}
