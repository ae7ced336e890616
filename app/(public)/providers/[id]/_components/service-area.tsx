"use client";
import dynamic from "next/dynamic";
import { useEffect, useRef, useState } from "react";

const ServiceAreaMap = dynamic(() => import("@/components/map/service-area-map"), {
  ssr: false,
  loading: () => <div className="h-full w-full animate-pulse bg-lagoon-50" />,
});

/** How far below the screen the map starts to load, so it is usually drawn by the time it scrolls into view. */
const LOAD_MARGIN = "400px";

export function ServiceArea(props: { point: { lat: number; lng: number }; radiusKm: number; kind: "hatchery" | "builder"; hostedStyleUrl: string | null }) {
  // The map library is about 300 KB gzipped, and on a phone this map sits below the reviews: load it only once the
  // box comes near the screen, so a visitor who reads the top of the page and leaves does not pay for it.
  const box = useRef<HTMLDivElement>(null);
  const [near, setNear] = useState(false);
  useEffect(() => {
    const el = box.current;
    if (!el || near) return;
    if (typeof IntersectionObserver === "undefined") {
      setNear(true);
      return;
    }
    const observer = new IntersectionObserver((entries) => {
      if (entries.some((e) => e.isIntersecting)) setNear(true);
    }, { rootMargin: LOAD_MARGIN });
    observer.observe(el);
    return () => observer.disconnect();
  }, [near]);
  return (
    <div ref={box} className="h-56 overflow-hidden rounded-card border border-silt-200" role="region" aria-label={`Map of the area served: ${props.radiusKm} km around an approximate point`}>
      {near ? <ServiceAreaMap {...props} /> : <div className="h-full w-full bg-lagoon-50" />}
    </div>
  );
}
