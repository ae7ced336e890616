"use client";
import dynamic from "next/dynamic";
import { useState } from "react";
import type { UseFormRegisterReturn } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { describedBy, Field, Input } from "@/components/ui/field";

// The map library loads only when someone opens the map (it is the heaviest part of the page).
const SitePickerMap = dynamic(() => import("@/components/map/site-picker-map"), {
  ssr: false,
  loading: () => <div className="h-full w-full animate-pulse bg-lagoon-50" />,
});

type Point = { lat: number; lng: number };

export type PointFieldsProps = {
  idPrefix: string;
  legend: string;
  hint: string;
  register: { lat: UseFormRegisterReturn<"lat">; lng: UseFormRegisterReturn<"lng"> };
  value: { lat: string; lng: string };
  errors: { lat?: string; lng?: string };
  /** where the map opens when no point is typed yet (the person's profile point, or a default) */
  center: Point;
  hostedStyleUrl: string | null;
  onPick: (point: Point) => void;
};

/** A point as typed coordinates, the browser's location, or a tap on a small map. */
export function PointFields({ idPrefix, legend, hint, register, value, errors, center, hostedStyleUrl, onPick }: PointFieldsProps) {
  const [mapOpen, setMapOpen] = useState(false);
  const [locating, setLocating] = useState(false);
  const [locateError, setLocateError] = useState<string | null>(null);
  const typed = Number(value.lat);
  const typedLng = Number(value.lng);
  const point = value.lat !== "" && value.lng !== "" && Number.isFinite(typed) && Number.isFinite(typedLng) && Math.abs(typed) <= 90 ? { lat: typed, lng: typedLng } : null;

  function locate() {
    setLocateError(null);
    if (!("geolocation" in navigator)) return setLocateError("This browser cannot share its location: type the coordinates or pick on the map.");
    setLocating(true);
    navigator.geolocation.getCurrentPosition(
      (pos) => {
        setLocating(false);
        onPick({ lat: Number(pos.coords.latitude.toFixed(6)), lng: Number(pos.coords.longitude.toFixed(6)) });
      },
      () => {
        setLocating(false);
        setLocateError("Your location was not shared. Type the coordinates or pick the place on the map.");
      },
      { enableHighAccuracy: true, timeout: 15_000 },
    );
  }

  return (
    <fieldset className="space-y-3">
      <legend className="text-sm font-medium text-silt-800">{legend}</legend>
      <p className="text-xs text-silt-600">{hint}</p>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id={`${idPrefix}-lat`} label="Latitude (decimal degrees)" error={errors.lat}>
          <Input id={`${idPrefix}-lat`} inputMode="decimal" autoComplete="off" placeholder="-15.4167" aria-invalid={Boolean(errors.lat)} aria-describedby={describedBy(`${idPrefix}-lat`, errors.lat)} {...register.lat} />
        </Field>
        <Field id={`${idPrefix}-lng`} label="Longitude (decimal degrees)" error={errors.lng}>
          <Input id={`${idPrefix}-lng`} inputMode="decimal" autoComplete="off" placeholder="28.2833" aria-invalid={Boolean(errors.lng)} aria-describedby={describedBy(`${idPrefix}-lng`, errors.lng)} {...register.lng} />
        </Field>
      </div>
      <div className="flex flex-wrap gap-2">
        <Button type="button" variant="secondary" onClick={locate} disabled={locating}>
          {locating ? "Finding you…" : "Use my location"}
        </Button>
        <Button type="button" variant="secondary" aria-expanded={mapOpen} onClick={() => setMapOpen((o) => !o)}>
          {mapOpen ? "Hide the map" : "Pick on a map"}
        </Button>
      </div>
      {locateError ? <p role="alert" className="text-sm font-medium text-clay-600">{locateError}</p> : null}
      {mapOpen ? (
        <div className="h-64 overflow-hidden rounded-card border border-silt-200" role="application" aria-label="Map: tap where the tank will stand">
          <SitePickerMap center={center} point={point} hostedStyleUrl={hostedStyleUrl} onPick={onPick} />
        </div>
      ) : null}
    </fieldset>
  );
}
