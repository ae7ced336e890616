import { relations, sql } from "drizzle-orm";
import { BATCH_STATES, LISTING_KINDS, ROLES, SPECIES, TANK_TYPES, VERIFICATION_STATES, type Species } from "../lib/catalog";
import { createdAt, updatedAt } from "./columns";
import { check, index, integer, primaryKey, real, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";


// ---------------------------------------------------------------------------
// Sign-in tables, in the shape better-auth's Drizzle adapter expects
// (model names user, session, account, verification, rateLimit).
// ---------------------------------------------------------------------------
export const user = sqliteTable("user", {
  id: text("id").primaryKey(),
  name: text("name").notNull(),
  email: text("email").notNull().unique(),
  emailVerified: integer("email_verified", { mode: "boolean" }).notNull().default(false),
  image: text("image"),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

export const session = sqliteTable(
  "session",
  {
    id: text("id").primaryKey(),
    expiresAt: integer("expires_at", { mode: "timestamp_ms" }).notNull(),
    token: text("token").notNull().unique(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
    ipAddress: text("ip_address"),
    userAgent: text("user_agent"),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
  },
  (t) => [index("session_user_id_idx").on(t.userId)],
);

export const account = sqliteTable(
  "account",
  {
    id: text("id").primaryKey(),
    accountId: text("account_id").notNull(),
    providerId: text("provider_id").notNull(),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    accessToken: text("access_token"),
    refreshToken: text("refresh_token"),
    idToken: text("id_token"),
    accessTokenExpiresAt: integer("access_token_expires_at", { mode: "timestamp_ms" }),
    refreshTokenExpiresAt: integer("refresh_token_expires_at", { mode: "timestamp_ms" }),
    scope: text("scope"),
    password: text("password"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("account_user_id_idx").on(t.userId)],
);

export const verification = sqliteTable(
  "verification",
  {
    id: text("id").primaryKey(),
    identifier: text("identifier").notNull(),
    value: text("value").notNull(),
    expiresAt: integer("expires_at", { mode: "timestamp_ms" }).notNull(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("verification_identifier_idx").on(t.identifier)],
);

// Rate-limit counters live in the database so that several app instances share them.
export const rateLimit = sqliteTable("rate_limit", {
  id: text("id").primaryKey(),
  key: text("key").notNull().unique(),
  count: integer("count").notNull(),
  lastRequest: integer("last_request").notNull(),
});

// Fixed-window counters of the app's own API limits (lib/api/rate-limit.ts): reservations and uploads. Not in
// rate_limit above: better-auth deletes every row there idle for longer than its own longest window (60 s), which
// would quietly reset a 10-minute window, and its last_request moves with each request rather than marking when a
// window opened. One row per (limit, account); the key says both, e.g. "reservation:create:<userId>".
export const apiRateLimit = sqliteTable("api_rate_limit", {
  key: text("key").primaryKey(),
  windowStartedAt: integer("window_started_at").notNull(),
  count: integer("count").notNull(),
});

// ---------------------------------------------------------------------------
// Roles and profiles
// ---------------------------------------------------------------------------

export const userRole = sqliteTable(
  "user_role",
  {
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    role: text("role", { enum: ROLES }).notNull(),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.role] })],
);


export const profile = sqliteTable(
  "profile",
  {
    userId: text("user_id")
      .primaryKey()
      .references(() => user.id, { onDelete: "cascade" }),
    displayName: text("display_name").notNull(),
    phone: text("phone"), // E.164, e.g. +260971234567
    region: text("region").notNull(),
    lat: real("lat"),
    lng: real("lng"),
    // Providers may show an approximate point (rounded to ~1 km) instead of the exact one.
    showApproximateLocation: integer("show_approximate_location", { mode: "boolean" }).notNull().default(true),
    about: text("about"),
    avatarImageId: text("avatar_image_id"),
    verificationState: text("verification_state", { enum: VERIFICATION_STATES }).notNull().default("unverified"),
    onboardedAt: integer("onboarded_at", { mode: "timestamp_ms" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("profile_lat_lng_idx").on(t.lat, t.lng)],
);


export const hatchery = sqliteTable("hatchery", {
  userId: text("user_id")
    .primaryKey()
    .references(() => profile.userId, { onDelete: "cascade" }),
  species: text("species", { mode: "json" }).$type<Species[]>().notNull().default(sql`'[]'`),
  delivers: integer("delivers", { mode: "boolean" }).notNull().default(false),
  deliveryRadiusKm: integer("delivery_radius_km").notNull().default(0),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

export const builder = sqliteTable("builder", {
  userId: text("user_id")
    .primaryKey()
    .references(() => profile.userId, { onDelete: "cascade" }),
  serviceRadiusKm: integer("service_radius_km").notNull().default(30),
  currency: text("currency").notNull().default("ZMW"),
  baseFeeMinor: integer("base_fee_minor").notNull().default(0),
  travelRatePerKmMinor: integer("travel_rate_per_km_minor").notNull().default(0),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

// A builder's price sheet: materials and labour per square metre of tank floor, per tank type.
export const builderPrice = sqliteTable(
  "builder_price",
  {
    builderId: text("builder_id")
      .notNull()
      .references(() => builder.userId, { onDelete: "cascade" }),
    tankType: text("tank_type", { enum: TANK_TYPES }).notNull(),
    materialsPerSqmMinor: integer("materials_per_sqm_minor").notNull(),
    labourPerSqmMinor: integer("labour_per_sqm_minor").notNull(),
  },
  (t) => [primaryKey({ columns: [t.builderId, t.tankType] })],
);

// Demo and uploaded images. Only processed (re-encoded, metadata-free) variants are served.
export const image = sqliteTable(
  "image",
  {
    id: text("id").primaryKey(),
    ownerId: text("owner_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    kind: text("kind").notNull(),
    keyPrefix: text("key_prefix").notNull(),
    widths: text("widths", { mode: "json" }).$type<number[]>().notNull(),
    width: integer("width").notNull(),
    height: integer("height").notNull(),
    alt: text("alt").notNull().default(""),
    // The object the image belongs to (tank request, portfolio item, job…), read together with `kind`.
    subjectId: text("subject_id"),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex("image_key_prefix_idx").on(t.keyPrefix), index("image_owner_idx").on(t.ownerId), index("image_kind_subject_idx").on(t.kind, t.subjectId)],
);

export const userRelations = relations(user, ({ one, many }) => ({
  profile: one(profile, { fields: [user.id], references: [profile.userId] }),
  roles: many(userRole),
}));
export const userRoleRelations = relations(userRole, ({ one }) => ({
  user: one(user, { fields: [userRole.userId], references: [user.id] }),
}));
export const profileRelations = relations(profile, ({ one }) => ({
  user: one(user, { fields: [profile.userId], references: [user.id] }),
  hatchery: one(hatchery, { fields: [profile.userId], references: [hatchery.userId] }),
  builder: one(builder, { fields: [profile.userId], references: [builder.userId] }),
}));
export const builderRelations = relations(builder, ({ many }) => ({
  prices: many(builderPrice),
}));
export const builderPriceRelations = relations(builderPrice, ({ one }) => ({
  builder: one(builder, { fields: [builderPrice.builderId], references: [builder.userId] }),
}));

export type User = typeof user.$inferSelect;
export type Profile = typeof profile.$inferSelect;

// Append-only record of admin decisions and money movements. Rows are never updated or deleted.
export const auditLog = sqliteTable(
  "audit_log",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    actorId: text("actor_id").references(() => user.id, { onDelete: "set null" }),
    action: text("action").notNull(),
    subjectType: text("subject_type").notNull(),
    subjectId: text("subject_id").notNull(),
    detail: text("detail", { mode: "json" }).$type<Record<string, unknown>>(),
    createdAt: createdAt(),
  },
  (t) => [index("audit_subject_idx").on(t.subjectType, t.subjectId)],
);

// ---------------------------------------------------------------------------
// Listings: one row per provider role (a hatchery, a builder), denormalised for the
// nearby search. Kept in step with the profile tables by lib/listings/sync.ts; the
// R*Tree index listing_rtree (created in a custom migration, kept by triggers) holds
// each listing's point for the bounding-box pre-filter.
// ---------------------------------------------------------------------------

export const listing = sqliteTable(
  "listing",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    userId: text("user_id")
      .notNull()
      .references(() => profile.userId, { onDelete: "cascade" }),
    kind: text("kind", { enum: LISTING_KINDS }).notNull(),
    displayName: text("display_name").notNull(),
    region: text("region").notNull(),
    // The public point: rounded to about 1 km unless the provider chose to show the exact one.
    lat: real("lat").notNull(),
    lng: real("lng").notNull(),
    verified: integer("verified", { mode: "boolean" }).notNull().default(false),
    // Bit sets: species tilapia=1, catfish=2; tank types tarpaulin=1, concrete=2, earthen=4.
    speciesMask: integer("species_mask").notNull().default(0),
    tankTypeMask: integer("tank_type_mask").notNull().default(0),
    serviceRadiusKm: integer("service_radius_km").notNull().default(0),
    avatarImageId: text("avatar_image_id"),
    trustScore: real("trust_score").notNull().default(0),
    // The trust badge a card or map popup shows (lib/trust/trust-stats.ts), kept beside the score so the nearby
    // search needs no extra query for it. Written by refreshListings with the score.
    trustIsNew: integer("trust_is_new", { mode: "boolean" }).notNull().default(true),
    trustRating: real("trust_rating"),
    trustReviews: integer("trust_reviews").notNull().default(0),
    trustJobsCompleted: integer("trust_jobs_completed").notNull().default(0),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("listing_user_kind_idx").on(t.userId, t.kind)],
);

// A hatchery's batch of fingerlings on offer.
export const batch = sqliteTable(
  "batch",
  {
    id: text("id").primaryKey(),
    hatcheryId: text("hatchery_id")
      .notNull()
      .references(() => hatchery.userId, { onDelete: "cascade" }),
    species: text("species", { enum: SPECIES }).notNull(),
    meanWeightG: real("mean_weight_g").notNull(),
    meanLengthCm: real("mean_length_cm").notNull(),
    countTotal: integer("count_total").notNull(),
    countAvailable: integer("count_available").notNull(),
    priceMinor: integer("price_minor").notNull(),
    currency: text("currency").notNull(),
    readyFrom: integer("ready_from", { mode: "timestamp_ms" }).notNull(),
    sellBy: integer("sell_by", { mode: "timestamp_ms" }).notNull(),
    delivery: text("delivery", { enum: ["pickup", "delivery", "both"] }).notNull().default("pickup"),
    state: text("state", { enum: BATCH_STATES }).notNull().default("open"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index("batch_hatchery_idx").on(t.hatcheryId, t.state, t.sellBy),
    // The database itself refuses to sell fish that are not there.
    check("batch_count_available_range", sql`${t.countAvailable} >= 0 AND ${t.countAvailable} <= ${t.countTotal}`),
  ],
);

// A saved run of the tank planner. Anyone with the link can read it (the id is a
// random UUID); only its owner can change or delete it.
export const plan = sqliteTable(
  "plan",
  {
    id: text("id").primaryKey(),
    ownerId: text("owner_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    // The planner input exactly as lib/validations/planner.ts accepts it (SI units).
    input: text("input", { mode: "json" }).$type<Record<string, unknown>>().notNull(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("plan_owner_idx").on(t.ownerId)],
);
