import { z } from "zod";
import { SPECIES, TANK_TYPES } from "@/lib/catalog";
import { isCurrencyCode } from "@/lib/money/money";

const minor = (label: string, max = 100_000_000) =>
  z
    .number({ error: `${label} must be a number` })
    .int(`${label} must be a whole number of minor units`)
    .min(0, `${label} cannot be negative`)
    .max(max, `${label} is too large`);

export const hatcheryProfileSchema = z
  .object({
    species: z.array(z.enum(SPECIES)).min(1, "Choose at least one species"),
    delivers: z.boolean(),
    deliveryRadiusKm: z.number({ error: "Delivery radius must be a number" }).int("Whole kilometres").min(0, "Cannot be negative").max(1000, "At most 1000 km"),
  })
  .refine((v) => !v.delivers || v.deliveryRadiusKm > 0, { path: ["deliveryRadiusKm"], message: "Say how far you deliver" });

export const builderProfileSchema = z.object({
  serviceRadiusKm: z.number({ error: "Service radius must be a number" }).int("Whole kilometres").min(1, "At least 1 km").max(1000, "At most 1000 km"),
  currency: z.string().refine(isCurrencyCode, "Use an ISO 4217 currency code such as ZMW"),
  baseFeeMinor: minor("Base fee"),
  travelRatePerKmMinor: minor("Travel rate", 10_000_000),
  prices: z
    .array(
      z.object({
        tankType: z.enum(TANK_TYPES),
        materialsPerSqmMinor: minor("Materials price"),
        labourPerSqmMinor: minor("Labour price"),
      }),
    )
    .max(TANK_TYPES.length)
    .refine((rows) => new Set(rows.map((r) => r.tankType)).size === rows.length, "Each tank type once"),
});

export type HatcheryProfileInput = z.infer<typeof hatcheryProfileSchema>;
export type BuilderProfileInput = z.infer<typeof builderProfileSchema>;

