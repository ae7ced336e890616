import { z } from "zod";
import { SPECIES, TANK_TYPES } from "@/lib/catalog";

const bool = z.enum(["true", "false", "1", "0"], { error: "Use true or false" }).transform((v) => v === "true" || v === "1");
// Query strings repeat a key for several values (?species=tilapia&species=catfish) or join them with commas.
const list = <T extends readonly [string, ...string[]]>(values: T, label: string) =>
  z
    .array(z.string())
    .transform((xs) => xs.flatMap((x) => x.split(",")).filter(Boolean))
    .pipe(z.array(z.enum(values, { error: `${label} must be one of ${values.join(", ")}` })).max(values.length * 2));

export const MAX_RADIUS_KM = 500;

export const nearbyQuerySchema = z.object({
  lat: z.coerce.number({ error: "lat must be a number" }).min(-90, "lat is between -90 and 90").max(90, "lat is between -90 and 90"),
  lng: z.coerce.number({ error: "lng must be a number" }).min(-180, "lng is between -180 and 180").max(180, "lng is between -180 and 180"),
  radiusKm: z.coerce.number({ error: "radiusKm must be a number" }).gt(0, "radiusKm must be more than 0").max(MAX_RADIUS_KM, `radiusKm is at most ${MAX_RADIUS_KM}`).default(50),
  kind: z.enum(["all", "hatchery", "builder"], { error: "kind is all, hatchery or builder" }).default("all"),
  tankType: list(TANK_TYPES, "tankType").default([]),
  species: list(SPECIES, "species").default([]),
  verified: bool.default(false),
  readyNow: bool.default(false),
  sort: z.enum(["distance", "trust"], { error: "sort is distance or trust" }).default("distance"),
  cursor: z.string().max(200, "cursor is too long").optional(),
  limit: z.coerce.number({ error: "limit must be a number" }).int("limit is a whole number").min(1, "limit is at least 1").max(100, "limit is at most 100").default(20),
});

export type NearbyQuery = z.output<typeof nearbyQuerySchema>;

/** Turns URLSearchParams into the object the schema reads (list keys as arrays). */
export function searchParamsToObject(params: URLSearchParams): Record<string, string | string[]> {
  const out: Record<string, string | string[]> = {};
  for (const key of new Set(params.keys())) {
    const all = params.getAll(key);
    out[key] = key === "tankType" || key === "species" ? all : (all[0] ?? "");
  }
  return out;
}
