// Tables for tank requests, quotes, jobs and portfolios. Kept apart from db/schema.ts.
// Relative imports only: drizzle-kit loads this file without the "@/" alias.
import { sql } from "drizzle-orm";
import { check, foreignKey, index, integer, primaryKey, real, sqliteTable, text, uniqueIndex } from "drizzle-orm/sqlite-core";
import { TANK_TYPES } from "../lib/catalog";
import type { QuoteLineKind } from "../lib/jobs/quote";
import type { JobResolution } from "../lib/jobs/state";
import {
  JOB_ROW_STATES,
  POWER_SOURCES,
  QUOTE_STATES,
  REQUEST_STATES,
  SITE_READINESS,
  SIZE_UNITS,
  TANK_SHAPES,
  WATER_SOURCES,
} from "../lib/jobs/vocabulary";
import { createdAt, updatedAt } from "./columns";
import { builder, plan, user } from "./schema";


// Inner size in metres, whatever unit the person typed (kept in `size_unit` to show it back the same way).
// A rectangular tank has length and width, a round one a diameter; the check keeps the row one or the other.
const sizeColumns = () => ({
  shape: text("shape", { enum: TANK_SHAPES }).notNull(),
  lengthM: real("length_m"),
  widthM: real("width_m"),
  diameterM: real("diameter_m"),
  depthM: real("depth_m").notNull(),
  sizeUnit: text("size_unit", { enum: SIZE_UNITS }).notNull().default("m"),
});
const sizeCheck = (name: string, t: { shape: unknown; lengthM: unknown; widthM: unknown; diameterM: unknown }) =>
  check(
    name,
    sql`(${t.shape} = 'rectangular' AND ${t.lengthM} > 0 AND ${t.widthM} > 0 AND ${t.diameterM} IS NULL) OR (${t.shape} = 'round' AND ${t.diameterM} > 0 AND ${t.lengthM} IS NULL AND ${t.widthM} IS NULL)`,
  );

/** A farmer's wanted tank. The site point is exact: builders see only the distance and a rounded place until a job exists. */
export const tankRequest = sqliteTable(
  "tank_request",
  {
    id: text("id").primaryKey(),
    farmerId: text("farmer_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    tankType: text("tank_type", { enum: TANK_TYPES }).notNull(),
    ...sizeColumns(),
    siteLat: real("site_lat").notNull(),
    siteLng: real("site_lng").notNull(),
    readiness: text("readiness", { enum: SITE_READINESS }).notNull(),
    waterSource: text("water_source", { enum: WATER_SOURCES }).notNull(),
    power: text("power", { enum: POWER_SOURCES }).notNull(),
    wantedBy: integer("wanted_by", { mode: "timestamp_ms" }).notNull(),
    planId: text("plan_id").references(() => plan.id, { onDelete: "set null" }),
    notes: text("notes").notNull().default(""),
    state: text("state", { enum: REQUEST_STATES }).notNull().default("open"),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index("tank_request_farmer_idx").on(t.farmerId, t.createdAt),
    // Builders' "open requests within reach": open rows in a latitude band, then the exact distance.
    index("tank_request_open_lat_idx").on(t.state, t.siteLat),
    sizeCheck("tank_request_size_check", t),
  ],
);

/** One builder's answer to one request. Its lines live in versions: a revision adds a version, never rewrites one. */
export const quote = sqliteTable(
  "quote",
  {
    id: text("id").primaryKey(),
    requestId: text("request_id")
      .notNull()
      .references(() => tankRequest.id, { onDelete: "cascade" }),
    builderId: text("builder_id")
      .notNull()
      .references(() => builder.userId, { onDelete: "cascade" }),
    state: text("state", { enum: QUOTE_STATES }).notNull().default("sent"),
    currentVersion: integer("current_version").notNull().default(1),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [uniqueIndex("quote_request_builder_idx").on(t.requestId, t.builderId), index("quote_builder_idx").on(t.builderId, t.state)],
);

/** A quote as sent at one moment, with the priced totals (lib/jobs/quote.ts priceQuote) frozen beside it. */
export const quoteVersion = sqliteTable(
  "quote_version",
  {
    quoteId: text("quote_id")
      .notNull()
      .references(() => quote.id, { onDelete: "cascade" }),
    version: integer("version").notNull(),
    currency: text("currency").notNull(),
    farmerSuppliesMaterials: integer("farmer_supplies_materials", { mode: "boolean" }).notNull(),
    note: text("note").notNull().default(""),
    /** straight-line metres from the builder's exact base to the site, and the rate per km then in force */
    travelDistanceM: integer("travel_distance_m").notNull(),
    travelRatePerKmMinor: integer("travel_rate_per_km_minor").notNull(),
    baseFeeMinor: integer("base_fee_minor").notNull(),
    subtotalMinor: integer("subtotal_minor").notNull(),
    totalMinor: integer("total_minor").notNull(),
    depositMinor: integer("deposit_minor").notNull(),
    excludedMaterialsMinor: integer("excluded_materials_minor").notNull(),
    createdAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.quoteId, t.version] })],
);

export const quoteLine = sqliteTable(
  "quote_line",
  {
    quoteId: text("quote_id").notNull(),
    version: integer("version").notNull(),
    position: integer("position").notNull(),
    kind: text("kind").$type<QuoteLineKind>().notNull(),
    description: text("description").notNull(),
    quantity: real("quantity").notNull(),
    unitPriceMinor: integer("unit_price_minor").notNull(),
    totalMinor: integer("total_minor").notNull(),
    /** false for materials the farmer supplies: shown, not charged */
    included: integer("included", { mode: "boolean" }).notNull(),
  },
  (t) => [
    primaryKey({ columns: [t.quoteId, t.version, t.position] }),
    foreignKey({ name: "quote_line_version_fk", columns: [t.quoteId, t.version], foreignColumns: [quoteVersion.quoteId, quoteVersion.version] }).onDelete("cascade"),
    check("quote_line_kind_check", sql`${t.kind} IN ('materials', 'labour', 'travel', 'other')`),
  ],
);

/** An accepted quote, from acceptance through the deposit to completion (lib/jobs/state.ts). */
export const job = sqliteTable(
  "job",
  {
    id: text("id").primaryKey(),
    requestId: text("request_id")
      .notNull()
      .references(() => tankRequest.id),
    quoteId: text("quote_id")
      .notNull()
      .references(() => quote.id),
    quoteVersion: integer("quote_version").notNull(),
    farmerId: text("farmer_id")
      .notNull()
      .references(() => user.id),
    builderId: text("builder_id")
      .notNull()
      .references(() => user.id),
    state: text("state", { enum: JOB_ROW_STATES }).notNull().default("awaiting_deposit"),
    currency: text("currency").notNull(),
    totalMinor: integer("total_minor").notNull(),
    depositMinor: integer("deposit_minor").notNull(),
    holdId: text("hold_id"),
    onSiteAt: integer("on_site_at", { mode: "timestamp_ms" }),
    builtAt: integer("built_at", { mode: "timestamp_ms" }),
    completionPhotoCount: integer("completion_photo_count"),
    resolution: text("resolution", { mode: "json" }).$type<JobResolution>(),
    /** when the job confirms itself if the farmer does nothing (set when built) */
    autoConfirmAt: integer("auto_confirm_at", { mode: "timestamp_ms" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    uniqueIndex("job_request_idx").on(t.requestId),
    uniqueIndex("job_quote_idx").on(t.quoteId),
    index("job_builder_idx").on(t.builderId, t.state),
    index("job_farmer_idx").on(t.farmerId, t.state),
    index("job_auto_confirm_idx").on(t.state, t.autoConfirmAt),
  ],
);

/** One row per move of a job (CONVENTIONS habit 6), including acceptance and the deposit. */
export const jobEvent = sqliteTable(
  "job_event",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    jobId: text("job_id")
      .notNull()
      .references(() => job.id, { onDelete: "cascade" }),
    event: text("event").notNull(),
    fromState: text("from_state", { enum: JOB_ROW_STATES }),
    toState: text("to_state", { enum: JOB_ROW_STATES }).notNull(),
    actorId: text("actor_id").references(() => user.id, { onDelete: "set null" }),
    actorRole: text("actor_role").notNull(),
    detail: text("detail", { mode: "json" }).$type<Record<string, unknown>>(),
    createdAt: createdAt(),
  },
  (t) => [index("job_event_job_idx").on(t.jobId, t.id)],
);

/**
 * A builder's finished tank. The place is stored already rounded (lib/geo/coordinates.ts roundCoordinate), so
 * no exact home is ever kept here. `job_id` set means the tank was built through Shoal (the mark).
 */
export const portfolioItem = sqliteTable(
  "portfolio_item",
  {
    id: text("id").primaryKey(),
    builderId: text("builder_id")
      .notNull()
      .references(() => builder.userId, { onDelete: "cascade" }),
    jobId: text("job_id").references(() => job.id),
    tankType: text("tank_type", { enum: TANK_TYPES }).notNull(),
    ...sizeColumns(),
    placeName: text("place_name").notNull(),
    approxLat: real("approx_lat").notNull(),
    approxLng: real("approx_lng").notNull(),
    completedOn: integer("completed_on", { mode: "timestamp_ms" }).notNull(),
    caption: text("caption").notNull().default(""),
    createdAt: createdAt(),
  },
  (t) => [index("portfolio_builder_idx").on(t.builderId, t.completedOn), uniqueIndex("portfolio_job_idx").on(t.jobId), sizeCheck("portfolio_size_check", t)],
);

/**
 * One row per completed upload id, written before the upload is processed: a second submit of the same
 * upload finds it and gets the same image back instead of storing the photo twice.
 */
export const uploadCompletion = sqliteTable("upload_completion", {
  uploadId: text("upload_id").primaryKey(),
  ownerId: text("owner_id")
    .notNull()
    .references(() => user.id, { onDelete: "cascade" }),
  imageId: text("image_id"),
  createdAt: createdAt(),
});
