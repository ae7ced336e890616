"use client";
import "maplibre-gl/dist/maplibre-gl.css";
import { Layer, Map, Marker, Source } from "@vis.gl/react-maplibre";
import { useMemo } from "react";
import { circlePolygon, mapStyle, prepareMapLibre } from "./map-style";
import { ProviderMark } from "./provider-marker";

type Props = { point: { lat: number; lng: number }; radiusKm: number; kind: "hatchery" | "builder"; hostedStyleUrl: string | null };

/** A small static map of where a provider works: its approximate base and the area it serves. */
export default function ServiceAreaMap({ point, radiusKm, kind, hostedStyleUrl }: Props) {
  prepareMapLibre();
  const style = useMemo(() => mapStyle(hostedStyleUrl), [hostedStyleUrl]);
  const zoom = Math.max(4, Math.min(11, 9.2 - Math.log2(Math.max(radiusKm, 1) / 10)));
  return (
    <Map
      initialViewState={{ longitude: point.lng, latitude: point.lat, zoom }}
      mapStyle={style}
      style={{ width: "100%", height: "100%" }}
      interactive={false}
      attributionControl={{ compact: true }}
    >
      {radiusKm > 0 ? (
        <Source id="service-area" type="geojson" data={circlePolygon(point, radiusKm)}>
          <Layer id="service-area-fill" type="fill" paint={{ "fill-color": kind === "builder" ? "#c27a1c" : "#176d64", "fill-opacity": 0.12 }} />
          <Layer id="service-area-line" type="line" paint={{ "line-color": kind === "builder" ? "#9d5f16" : "#135851", "line-width": 1.5 }} />
        </Source>
      ) : null}
      <Marker longitude={point.lng} latitude={point.lat} anchor="center">
        <ProviderMark kind={kind} />
      </Marker>
    </Map>
  );
}
