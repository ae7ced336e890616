import type { JobState } from "./state";

// The fixed vocabularies of tank requests, quotes, jobs and portfolios. No runtime imports, so db/schema-jobs.ts
// (loaded by drizzle-kit, which does not resolve the "@/" alias) and browser code can both use them.

export const TANK_SHAPES = ["rectangular", "round"] as const;
export type TankShape = (typeof TANK_SHAPES)[number];

export const SIZE_UNITS = ["m", "ft"] as const;
export type SizeUnit = (typeof SIZE_UNITS)[number];

export const SITE_READINESS = ["level_slab", "compacted_ground", "bare_ground"] as const;
export type SiteReadiness = (typeof SITE_READINESS)[number];
export const SITE_READINESS_LABEL: Record<SiteReadiness, string> = {
  level_slab: "Level concrete slab",
  compacted_ground: "Compacted ground",
  bare_ground: "Bare ground",
};

export const WATER_SOURCES = ["borehole", "mains", "river_or_dam", "rainwater", "none"] as const;
export type WaterSource = (typeof WATER_SOURCES)[number];
export const WATER_SOURCE_LABEL: Record<WaterSource, string> = {
  borehole: "Borehole or well",
  mains: "Piped mains water",
  river_or_dam: "River, stream or dam",
  rainwater: "Rainwater only",
  none: "No water at the site yet",
};

export const POWER_SOURCES = ["grid", "solar", "generator", "none"] as const;
export type PowerSource = (typeof POWER_SOURCES)[number];
export const POWER_SOURCE_LABEL: Record<PowerSource, string> = {
  grid: "Grid electricity",
  solar: "Solar",
  generator: "Generator",
  none: "No power at the site",
};

/** open: builders may quote · awarded: a quote was accepted · closed: the farmer took it down. */
export const REQUEST_STATES = ["open", "awarded", "closed"] as const;
export type RequestState = (typeof REQUEST_STATES)[number];

/** sent: the farmer may accept · withdrawn: the builder took it back · accepted · declined: another quote won. */
export const QUOTE_STATES = ["sent", "withdrawn", "accepted", "declined"] as const;
export type QuoteState = (typeof QUOTE_STATES)[number];

/**
 * A job row exists from acceptance, so the deposit hold has a subject to name; lib/jobs/state.ts starts at
 * "scheduled", once the deposit is held. "awaiting_deposit" is the one state before that.
 */
export const JOB_ROW_STATES = ["awaiting_deposit", "scheduled", "on_site", "built", "completed", "disputed", "resolved", "cancelled"] as const;
export type JobRowState = (typeof JOB_ROW_STATES)[number];

type SameKeys<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const statesMatch: SameKeys<Exclude<JobRowState, "awaiting_deposit">, JobState> = true;
void statesMatch;

export const JOB_STATE_LABEL: Record<JobRowState, string> = {
  awaiting_deposit: "Waiting for the deposit",
  scheduled: "Scheduled",
  on_site: "Builder on site",
  built: "Built: waiting for the farmer",
  completed: "Completed",
  disputed: "In dispute",
  resolved: "Dispute settled",
  cancelled: "Cancelled",
};
