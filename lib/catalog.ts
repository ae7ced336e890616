// The fixed vocabularies of the product, free of any dependency so that both the
// database schema and browser code can import them without pulling in either.
export const ROLES = ["farmer", "hatchery", "builder", "admin"] as const;
export type Role = (typeof ROLES)[number];

export const VERIFICATION_STATES = ["unverified", "pending", "verified", "rejected"] as const;
export type VerificationState = (typeof VERIFICATION_STATES)[number];

export const SPECIES = ["tilapia", "catfish"] as const;
export type Species = (typeof SPECIES)[number];

export const TANK_TYPES = ["tarpaulin", "concrete", "earthen"] as const;
export type TankType = (typeof TANK_TYPES)[number];

export const LISTING_KINDS = ["hatchery", "builder"] as const;
export type ListingKind = (typeof LISTING_KINDS)[number];

export const BATCH_STATES = ["open", "paused", "closed"] as const;
export type BatchState = (typeof BATCH_STATES)[number];

export const SPECIES_LABEL: Record<Species, string> = { tilapia: "Nile tilapia", catfish: "African catfish" };
export const TANK_TYPE_LABEL: Record<TankType, string> = {
  tarpaulin: "Tarpaulin on frame",
  concrete: "Concrete",
  earthen: "Earthen pond",
};
