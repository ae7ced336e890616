import type { FishSpecies } from "./species";

/*
 * Daily ration as % of body weight by size class. No complete FAO or SRAC size-class table was found for either species
 * (REFERENCE-VALUES section 2, Gap), so each class carries the trial or handbook row it comes from; where the row gave a
 * rate by month rather than by weight, the class bounds are our placement (a product choice), stated beside the row.
 *
 * The planner uses this table for the SHAPE of feeding over the cycle (how the ration moves from week to week as fish
 * grow), then scales the whole cycle so total feed ÷ biomass gain equals the FCR the user gave. Why: the FCR is what a
 * farmer knows from the feed bag or their own records and what sets the feed bill, while the % BW tables come from trials
 * in other systems; scaling keeps the bill honest to the FCR and the weekly pattern honest to the tables.
 */

export interface FeedingClass {
  /** The class applies to fish lighter than this, g. */
  upToG: number;
  percentBodyWeightPerDay: number;
  source: string;
}

export const FEEDING_TABLES: Readonly<Record<FishSpecies, readonly FeedingClass[]>> = {
  tilapia: [
    { upToG: 1, percentBodyWeightPerDay: 15, source: "Rakocy, SRAC 282 (1989): fry ration lowered from 20 % to 15 % BW/day by day 30 (REFERENCE-VALUES 2.1)" },
    {
      upToG: 55,
      percentBodyWeightPerDay: 6,
      source:
        "Egyptian earthen-pond trial, month 1 from 26 g: 6 % (REFERENCE-VALUES 2.3); extended down to 1 g, between the 5 % found best and the 7 % tested from 0.9 g by El-Saidy & Hussein 2015 (2.5)",
    },
    { upToG: 75, percentBodyWeightPerDay: 5, source: "Egyptian earthen-pond trial, month 2: 5 % (REFERENCE-VALUES 2.3); bound at the model weight after month 1 from 26 g" },
    { upToG: 100, percentBodyWeightPerDay: 4, source: "Egyptian earthen-pond trial, month 3: 4 % (REFERENCE-VALUES 2.3); bound at the model weight after month 2" },
    { upToG: 135, percentBodyWeightPerDay: 3, source: "Egyptian earthen-pond trial, month 4: 3 % (REFERENCE-VALUES 2.3); bound at the model weight after month 3" },
    { upToG: 500, percentBodyWeightPerDay: 2.5, source: "Egyptian earthen-pond trial, after month 4: 2.5 % (REFERENCE-VALUES 2.3)" },
    { upToG: Number.POSITIVE_INFINITY, percentBodyWeightPerDay: 1.5, source: "Tank culture of tilapia (SRAC 282 text): about 1.0 to 1.5 % of biomass at market size, about 680 g (REFERENCE-VALUES 2.2)" },
  ],
  catfish: [
    { upToG: 5, percentBodyWeightPerDay: 15, source: "Feeding-frequency trial on African catfish fry and fingerlings: 15 % BW/day in 3 meals (REFERENCE-VALUES 2.11)" },
    { upToG: 50, percentBodyWeightPerDay: 5, source: "Clarias gariepinus fingerlings from 5.9 g: 5 % BW/day recommended (REFERENCE-VALUES 2.10); upper bound a product choice" },
    { upToG: 150, percentBodyWeightPerDay: 4, source: "Basharat et al., Sarhad J. Agric. 39(1): 4 % BW/day best economics in ponds (REFERENCE-VALUES 2.9; also the 4 % of 1.5); bounds a product choice" },
    { upToG: 500, percentBodyWeightPerDay: 2.5, source: "Worked ration for 180 g catfish at 2.5 % BW/day (catfishplus blog, REFERENCE-VALUES 2.13)" },
    { upToG: Number.POSITIVE_INFINITY, percentBodyWeightPerDay: 1.5, source: "From memory: no catfish row seen above 500 g; the tilapia market-size ration (REFERENCE-VALUES 2.2) is used" },
  ],
};

export function feedingClassFor(species: FishSpecies, meanWeightG: number): FeedingClass {
  const table = FEEDING_TABLES[species];
  // The last row is open-ended, so only NaN (which the schema never lets through) falls past every row.
  const found = table.find((row) => meanWeightG < row.upToG) ?? table[table.length - 1];
  if (!found) throw new Error(`Feeding table for ${species} is empty`);
  return found;
}

export function feedingRatePercent(species: FishSpecies, meanWeightG: number): number {
  return feedingClassFor(species, meanWeightG).percentBodyWeightPerDay;
}

/** Ration = mean weight × rate × number of fish (REFERENCE-VALUES 2.13), kg per day. */
export function dailyRationKg(meanWeightG: number, percentBodyWeightPerDay: number, fishCount: number): number {
  return (meanWeightG * (percentBodyWeightPerDay / 100) * fishCount) / 1000;
}

/**
 * Total feed for a cycle from the FCR: feed = FCR × (harvested biomass − stocked biomass). That gain is the farm
 * ("economic") FCR's denominator, so fish lost on the way count as feed with nothing to show. No gain → no feed figure.
 */
export function feedForGainKg(fcr: number, biomassGainKg: number): number {
  return fcr * Math.max(0, biomassGainKg);
}
