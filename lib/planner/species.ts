import type { PlanInput } from "@/lib/validations/planner";

export type FishSpecies = "tilapia" | "catfish";
export const FISH_SPECIES: readonly FishSpecies[] = ["tilapia", "catfish"];

export const SPECIES_NAMES: Readonly<Record<FishSpecies, string>> = { tilapia: "Nile tilapia", catfish: "African catfish" };

/** Share of the stocked fish that belong to each species; a species with share 0 is not in the tank. */
export function speciesShares(input: Pick<PlanInput, "species" | "tilapiaShareOfFishFraction">): Record<FishSpecies, number> {
  if (input.species === "tilapia") return { tilapia: 1, catfish: 0 };
  if (input.species === "catfish") return { tilapia: 0, catfish: 1 };
  return { tilapia: input.tilapiaShareOfFishFraction, catfish: 1 - input.tilapiaShareOfFishFraction };
}

export function speciesInTank(shares: Record<FishSpecies, number>): FishSpecies[] {
  return FISH_SPECIES.filter((species) => shares[species] > 0);
}
