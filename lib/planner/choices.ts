// The planner's fixed choices, free of zod so that estimatePlan can run in the browser
// without loading the validation library first.
export const TANK_TYPES = ["tarpaulin", "concrete", "earthen"] as const;
export const TANK_SHAPES = ["rectangular", "round"] as const;
export const SPECIES_CHOICES = ["tilapia", "catfish", "both"] as const;
export const LINER_COLOURS = ["blue", "white", "black", "other"] as const;
export const SUN_EXPOSURES = ["full-sun", "part-shade", "shade"] as const;

export type TankType = (typeof TANK_TYPES)[number];
export type TankShape = (typeof TANK_SHAPES)[number];
export type SpeciesChoice = (typeof SPECIES_CHOICES)[number];
export type LinerColour = (typeof LINER_COLOURS)[number];
export type SunExposure = (typeof SUN_EXPOSURES)[number];

/** A water-change schedule: a fraction of the tank's water replaced every `intervalDays`. */
export type WaterChangeSchedule = { intervalDays: number; fractionExchanged: number };

/**
 * Default water-change schedule by tank type (common practice): a tank with no soil gets a full change every week;
 * an earthen pond is only topped up and partly exchanged, here a tenth of its water a week.
 */
export const DEFAULT_WATER_CHANGE: Readonly<Record<TankType, WaterChangeSchedule>> = {
  tarpaulin: { intervalDays: 7, fractionExchanged: 1 },
  concrete: { intervalDays: 7, fractionExchanged: 1 },
  earthen: { intervalDays: 7, fractionExchanged: 0.1 },
};
