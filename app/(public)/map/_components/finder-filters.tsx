"use client";
import { useId, useState } from "react";
import { SPECIES_LABEL, TANK_TYPE_LABEL, type Species, type TankType } from "@/lib/catalog";
import { findPlaces } from "@/lib/places/gazetteer";
import { RADIUS_CHOICES, type FinderParams } from "./use-finder-params";

const chip =
  "inline-flex min-h-10 cursor-pointer items-center gap-2 rounded-full border border-silt-300 bg-white px-3 text-sm text-silt-800 has-[:checked]:border-lagoon-600 has-[:checked]:bg-lagoon-600 has-[:checked]:text-white has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-reed-500";

function toggle<T>(list: T[], value: T): T[] {
  return list.includes(value) ? list.filter((v) => v !== value) : [...list, value];
}

export function FinderFilters({ params, update }: { params: FinderParams; update: (next: Partial<FinderParams>) => void }) {
  const [placeText, setPlaceText] = useState(params.place);
  const [message, setMessage] = useState<string | null>(null);
  // On phones the detailed filters fold away so the results stay in view; wide screens always show them.
  const [open, setOpen] = useState(false);
  const active = (params.kind !== "all" ? 1 : 0) + params.tankType.length + params.species.length + (params.verified ? 1 : 0) + (params.readyNow ? 1 : 0);
  const listId = useId();
  const suggestions = findPlaces(placeText);

  function choosePlace(text: string) {
    const match = findPlaces(text)[0];
    if (!match) {
      setMessage(`We do not know "${text}". Pick a town from the list, or use your location.`);
      return;
    }
    setMessage(null);
    setPlaceText(match.name);
    update({ lat: match.lat, lng: match.lng, place: match.name });
  }

  function nearMe() {
    if (!("geolocation" in navigator)) {
      setMessage("This browser cannot share its location. Type a town instead.");
      return;
    }
    setMessage("Finding you…");
    navigator.geolocation.getCurrentPosition(
      (pos) => {
        setMessage(null);
        setPlaceText("");
        update({ lat: pos.coords.latitude, lng: pos.coords.longitude, place: "" });
      },
      () => setMessage("We could not get your location. Type a town instead."),
      { enableHighAccuracy: false, timeout: 10_000, maximumAge: 600_000 },
    );
  }

  return (
    <form className="space-y-4 px-4 py-4" onSubmit={(e) => { e.preventDefault(); choosePlace(placeText); }} aria-label="Filters">
      <div>
        <label htmlFor="place" className="block text-sm font-medium text-silt-800">
          Near
        </label>
        <div className="mt-1 flex gap-2">
          <input
            id="place"
            list={listId}
            value={placeText}
            onChange={(e) => setPlaceText(e.target.value)}
            onBlur={(e) => { if (e.target.value && e.target.value !== params.place) choosePlace(e.target.value); }}
            placeholder="Town, e.g. Kabwe"
            autoComplete="off"
            className="min-h-11 min-w-0 flex-1 rounded-lg border border-silt-300 bg-white px-3"
          />
          <datalist id={listId}>
            {suggestions.map((p) => (
              <option key={p.name} value={p.name}>{`${p.region}, ${p.country}`}</option>
            ))}
          </datalist>
          <button type="button" onClick={nearMe} className="min-h-11 shrink-0 rounded-lg border border-silt-300 bg-white px-3 text-sm font-medium text-silt-800 hover:bg-silt-100">
            Near me
          </button>
        </div>
        {message ? (
          <p role="status" className="mt-1 text-sm text-silt-700">
            {message}
          </p>
        ) : null}
      </div>

      <div className="grid grid-cols-2 gap-3">
        <div>
          <label htmlFor="radius" className="block text-sm font-medium text-silt-800">
            Within
          </label>
          <select id="radius" value={params.radiusKm} onChange={(e) => update({ radiusKm: Number(e.target.value) })} className="mt-1 min-h-11 w-full rounded-lg border border-silt-300 bg-white px-2">
            {RADIUS_CHOICES.map((r) => (
              <option key={r} value={r}>
                {r} km
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="sort" className="block text-sm font-medium text-silt-800">
            Order
          </label>
          <select id="sort" value={params.sort} onChange={(e) => update({ sort: e.target.value === "trust" ? "trust" : "distance" })} className="mt-1 min-h-11 w-full rounded-lg border border-silt-300 bg-white px-2">
            <option value="distance">Nearest first</option>
            <option value="trust">Most trusted first</option>
          </select>
        </div>
      </div>

      <button
        type="button"
        aria-expanded={open}
        aria-controls="more-filters"
        onClick={() => setOpen((o) => !o)}
        className="min-h-11 w-full rounded-lg border border-silt-300 bg-white px-3 text-left text-sm font-semibold text-silt-800 lg:hidden"
      >
        {open ? "Hide filters" : `Filters${active ? ` (${active} on)` : ""}`}
      </button>
      <div id="more-filters" className={`${open ? "block" : "hidden"} space-y-4 lg:block`}>
      <fieldset>
        <legend className="text-sm font-medium text-silt-800">Looking for</legend>
        <div className="mt-1 flex flex-wrap gap-2">
          {(["all", "builder", "hatchery"] as const).map((k) => (
            <label key={k} className={chip}>
              <input type="radio" name="kind" className="sr-only" checked={params.kind === k} onChange={() => update({ kind: k })} />
              {k === "all" ? "Everyone" : k === "builder" ? "Tank builders" : "Hatcheries"}
            </label>
          ))}
        </div>
      </fieldset>

      {params.kind !== "hatchery" ? (
        <fieldset>
          <legend className="text-sm font-medium text-silt-800">Builds</legend>
          <div className="mt-1 flex flex-wrap gap-2">
            {(Object.keys(TANK_TYPE_LABEL) as TankType[]).map((t) => (
              <label key={t} className={chip}>
                <input type="checkbox" className="sr-only" checked={params.tankType.includes(t)} onChange={() => update({ tankType: toggle(params.tankType, t) })} />
                {TANK_TYPE_LABEL[t]}
              </label>
            ))}
          </div>
        </fieldset>
      ) : null}

      {params.kind !== "builder" ? (
        <fieldset>
          <legend className="text-sm font-medium text-silt-800">Sells fingerlings of</legend>
          <div className="mt-1 flex flex-wrap gap-2">
            {(Object.keys(SPECIES_LABEL) as Species[]).map((s) => (
              <label key={s} className={chip}>
                <input type="checkbox" className="sr-only" checked={params.species.includes(s)} onChange={() => update({ species: toggle(params.species, s) })} />
                {SPECIES_LABEL[s]}
              </label>
            ))}
          </div>
        </fieldset>
      ) : null}

      <div className="flex flex-wrap gap-2">
        <label className={chip}>
          <input type="checkbox" className="sr-only" checked={params.verified} onChange={(e) => update({ verified: e.target.checked })} />
          Checked by Shoal only
        </label>
        <label className={chip}>
          <input type="checkbox" className="sr-only" checked={params.readyNow} onChange={(e) => update({ readyNow: e.target.checked })} />
          Fingerlings ready now
        </label>
      </div>
      </div>
    </form>
  );
}
