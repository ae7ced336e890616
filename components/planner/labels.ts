import type { LinerColour, SpeciesChoice, SunExposure, TankShape, TankType } from "@/lib/validations/planner";

/* The words the planner shows for each choice of the schema. */

export const TANK_TYPE_LABEL: Record<TankType, string> = {
  tarpaulin: "Tarpaulin on a frame",
  concrete: "Concrete",
  earthen: "Earthen pond",
};

export const TANK_TYPE_NOTE: Record<TankType, string> = {
  tarpaulin: "Cheapest, quick to put up; the liner wears out in a few years.",
  concrete: "Costs more, lasts decades, easy to drain and clean.",
  earthen: "Dug into the ground; holds natural food, needs space and soil that holds water.",
};

export const TANK_SHAPE_LABEL: Record<TankShape, string> = { rectangular: "Rectangular", round: "Round" };

export const SPECIES_LABEL: Record<SpeciesChoice, string> = {
  tilapia: "Nile tilapia",
  catfish: "African catfish",
  both: "Both together",
};

export const LINER_LABEL: Record<LinerColour, string> = { blue: "Blue", white: "White", black: "Black", other: "Another colour" };

export const SUN_LABEL: Record<SunExposure, string> = { "full-sun": "Full sun all day", "part-shade": "Part shade", shade: "Mostly shaded" };
