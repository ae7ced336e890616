"use client";
import "maplibre-gl/dist/maplibre-gl.css";
import { Map, Marker, NavigationControl } from "@vis.gl/react-maplibre";
import { useMemo } from "react";
import { mapStyle, prepareMapLibre } from "./map-style";

type Point = { lat: number; lng: number };
type Props = { center: Point; point: Point | null; hostedStyleUrl: string | null; onPick: (point: Point) => void };

/** Tap or click where the tank will stand; the marker can be dragged to fine-tune. */
export default function SitePickerMap({ center, point, hostedStyleUrl, onPick }: Props) {
  prepareMapLibre();
  const style = useMemo(() => mapStyle(hostedStyleUrl), [hostedStyleUrl]);
  const round = (p: Point): Point => ({ lat: Number(p.lat.toFixed(6)), lng: Number(p.lng.toFixed(6)) }); // ~0.1 m
  return (
    <Map
      initialViewState={{ longitude: point?.lng ?? center.lng, latitude: point?.lat ?? center.lat, zoom: point ? 13 : 7 }}
      mapStyle={style}
      style={{ width: "100%", height: "100%" }}
      attributionControl={{ compact: true }}
      cursor="crosshair"
      onClick={(e) => onPick(round({ lat: e.lngLat.lat, lng: e.lngLat.lng }))}
    >
      <NavigationControl position="top-right" showCompass={false} />
      {point ? (
        <Marker longitude={point.lng} latitude={point.lat} anchor="bottom" draggable onDragEnd={(e) => onPick(round({ lat: e.lngLat.lat, lng: e.lngLat.lng }))}>
          <svg viewBox="0 0 24 32" className="h-8 w-6 drop-shadow" aria-hidden="true">
            <path d="M12 0C5.4 0 0 5.2 0 11.7 0 20.4 12 32 12 32s12-11.6 12-20.3C24 5.2 18.6 0 12 0Z" fill="#9d5f16" />
            <circle cx="12" cy="11.5" r="4.5" fill="#fff" />
          </svg>
        </Marker>
      ) : null}
    </Map>
  );
}
