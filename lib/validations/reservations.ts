import * as z from "zod/mini";
import { SPECIES } from "@/lib/catalog";
import { isCurrencyCode, minorDigits, toMinor } from "@/lib/money/money";
import { RESERVATION_FILTERS, RESERVATION_SORTS } from "@/lib/reservations/list-options";

// Shared by the batch and reservation forms (react-hook-form's zod resolver) and the route handlers that parse
// the same bodies. Numbers may arrive as typed text ("1,50") from a form or as JSON numbers from the API.
// Written with zod/mini, the tree-shakable form of zod 4, because browsers load this module (the forms, and the
// hatchery's table for its filter names): all of zod would add about 31 KB gzipped to those pages. The server
// parses the same schema objects with zod. zod/mini ships no locale, so every rule carries its own message.

export const BATCH_DELIVERY = ["pickup", "delivery", "both"] as const;
export const HANDOVER_METHODS = ["pickup", "delivery"] as const;
export const BATCH_ACTIONS = ["pause", "resume", "close"] as const;

function numberFrom(label: string) {
  const Label = `${label[0]?.toUpperCase() ?? ""}${label.slice(1)}`;
  return z.pipe(
    // Neither a number nor text (only an API client can send that): the union and both branches say the same, since
    // the server reports the union's message and react-hook-form's resolver the closest branch's.
    z.union([z.number({ error: `Enter ${label}` }), z.string({ error: `Enter ${label}` }).check(z.trim(), z.minLength(1, `Enter ${label}`))], { error: `Enter ${label}` }),
    z.transform((value: number | string, ctx) => {
      const n = typeof value === "number" ? value : Number(value.replace(",", "."));
      if (!Number.isFinite(n)) {
        ctx.issues.push({ code: "custom", message: `${Label} must be a number`, input: value });
        return z.NEVER;
      }
      return n;
    }),
  );
}

const wholeNumber = (label: string, min: number, max: number) =>
  z.pipe(
    numberFrom(label),
    z.number().check(z.int(`Whole ${label.replace(/^the /, "")} only`), z.gte(min, `At least ${min.toLocaleString("en")}`), z.lte(max, `At most ${max.toLocaleString("en")}`)),
  );

const isoDate = (label: string) =>
  z.string({ error: `Choose ${label}` }).check(
    z.regex(/^\d{4}-\d{2}-\d{2}$/, `Choose ${label}`),
    z.refine((s: string) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)), `Choose ${label}`),
  );

const CURRENCY_MESSAGE = "Use an ISO 4217 currency code such as ZMW";

const batchFields = z
  .object({
    species: z.enum(SPECIES, { error: "Choose a species" }),
    // Fingerlings are sold from about 1 g; a 500 g fish is no longer a fingerling (common practice).
    meanWeightG: z.pipe(numberFrom("the mean weight"), z.number().check(z.gt(0, "More than 0 g"), z.lte(500, "At most 500 g"))),
    meanLengthCm: z.pipe(numberFrom("the mean length"), z.number().check(z.gt(0, "More than 0 cm"), z.lte(40, "At most 40 cm"))),
    countAvailable: wholeNumber("fish", 1, 1_000_000),
    pricePerFish: z.pipe(numberFrom("the price"), z.number().check(z.gt(0, "More than 0"), z.lte(10_000, "At most 10,000 per fish"))),
    currency: z.string({ error: CURRENCY_MESSAGE }).check(z.refine(isCurrencyCode, CURRENCY_MESSAGE)),
    readyFrom: isoDate("the date the fish are ready"),
    sellBy: isoDate("the last day you sell this batch"),
    delivery: z.enum(BATCH_DELIVERY, { error: "Choose how buyers get the fish" }),
  })
  .check(
    z.superRefine((v, ctx) => {
      if (v.sellBy < v.readyFrom) ctx.addIssue({ code: "custom", path: ["sellBy"], message: "The last day must be on or after the ready date" });
      // This runs even when the currency field failed its check (zod keeps refining past non-fatal issues), and
      // Intl.NumberFormat throws a RangeError for a code it does not know: that field's issue is reported already.
      if (!isCurrencyCode(v.currency)) return;
      const digits = minorDigits(v.currency);
      if (Math.abs(v.pricePerFish * 10 ** digits - Math.round(v.pricePerFish * 10 ** digits)) > 1e-6) {
        ctx.addIssue({ code: "custom", path: ["pricePerFish"], message: digits === 0 ? `${v.currency} has no smaller unit: use a whole number` : `At most ${digits} decimal places` });
      }
    }),
  );

export const batchFormSchema = z.pipe(
  batchFields,
  z.transform((v: z.output<typeof batchFields>) => ({ ...v, priceMinor: toMinor(v.pricePerFish, v.currency) })),
);

export type BatchFormInput = z.input<typeof batchFormSchema>;
export type BatchFormValues = z.output<typeof batchFormSchema>;

export const batchActionSchema = z.object({ action: z.enum(BATCH_ACTIONS, { error: "Choose pause, resume or close" }) });

export const reserveSchema = z.object({
  batchId: z.string({ error: "Choose a batch" }).check(z.minLength(1, "Choose a batch"), z.maxLength(100, "Choose a batch")),
  count: wholeNumber("fish", 1, 1_000_000),
  handoverMethod: z.enum(HANDOVER_METHODS, { error: "Choose collection or delivery" }),
  note: z.optional(z.string({ error: "Write the note as text" }).check(z.trim(), z.maxLength(500, "At most 500 characters"))),
});
export type ReserveInput = z.input<typeof reserveSchema>;
export type ReserveValues = z.output<typeof reserveSchema>;

export const paySchema = z.object({
  paymentMethod: z.string({ error: "Choose how to pay" }).check(z.regex(/^pm_[A-Za-z0-9_]{1,80}$/, "Choose how to pay")),
});
export type PayInput = z.infer<typeof paySchema>;

export const QUARANTINE_ITEMS = ["hapa", "acclimatise", "watch", "remove_dead", "treat", "release"] as const;

const reason = (min: number, what: string) => z.string({ error: `Say in a few words ${what}` }).check(z.trim(), z.minLength(min, `Say in a few words ${what}`), z.maxLength(1000, "At most 1000 characters"));
const optionalNote = (max: number, message: string) => z.optional(z.string({ error: "Write the note as text" }).check(z.trim(), z.maxLength(max, message)));

export const handOverSchema = z.object({ action: z.literal("hand_over"), count: wholeNumber("fish", 1, 1_000_000) });
export const survivalSchema = z.object({ action: z.literal("report_survival"), survived: wholeNumber("fish", 0, 1_000_000) });
export const disputeSchema = z.object({ action: z.literal("dispute"), reason: reason(10, "what went wrong") });
export type HandOverInput = z.input<typeof handOverSchema>;
export type SurvivalInput = z.input<typeof survivalSchema>;
export type DisputeInput = z.input<typeof disputeSchema>;

export const reservationActionSchema = z.discriminatedUnion(
  "action",
  [
    z.object({ action: z.literal("accept") }),
    z.object({ action: z.literal("decline"), reason: optionalNote(500, "At most 500 characters") }),
    z.object({ action: z.literal("cancel"), reason: optionalNote(500, "At most 500 characters") }),
    handOverSchema,
    survivalSchema,
    disputeSchema,
    z.object({
      action: z.literal("resolve_dispute"),
      outcome: z.enum(["for_farmer", "for_provider"], { error: "Decide for the farmer or for the provider" }),
      note: optionalNote(2000, "Keep the note under 2000 characters"),
    }),
    z.object({ action: z.literal("refund") }),
    z.object({ action: z.literal("check"), item: z.enum(QUARANTINE_ITEMS, { error: "Choose an item of the quarantine list" }), done: z.boolean({ error: "Done must be true or false" }) }),
  ],
  { error: "Unknown action" },
);
export type ReservationActionInput = z.input<typeof reservationActionSchema>;
export type ReservationAction = z.output<typeof reservationActionSchema>;

// The list's vocabulary lives apart so that the hatchery's table can name it without loading these schemas.
export { RESERVATION_FILTERS, RESERVATION_SORTS };

const wholeParam = (label: string, min: number, max: number, fallback: number) => {
  const message = `${label} is a whole number from ${min.toLocaleString("en")} to ${max.toLocaleString("en")}`;
  return z._default(z.coerce.number({ error: message }).check(z.int(message), z.gte(min, message), z.lte(max, message)), fallback);
};

export const reservationListQuerySchema = z.object({
  as: z._default(z.enum(["farmer", "hatchery"], { error: "List as farmer or hatchery" }), "farmer"),
  state: z._default(z.enum(RESERVATION_FILTERS, { error: `State is one of: ${RESERVATION_FILTERS.join(", ")}` }), "all"),
  batchId: z.optional(z.string({ error: "Name one batch" }).check(z.maxLength(100, "Name one batch"))),
  q: z.optional(z.string({ error: "Search for text" }).check(z.trim(), z.maxLength(100, "Search for at most 100 characters"))),
  sort: z._default(z.enum(RESERVATION_SORTS, { error: `Sort by one of: ${RESERVATION_SORTS.join(", ")}` }), "requestedAt"),
  dir: z._default(z.enum(["asc", "desc"], { error: "Direction is asc or desc" }), "desc"),
  page: wholeParam("Page", 1, 10_000, 1),
  pageSize: wholeParam("Page size", 5, 100, 10),
});
export type ReservationListQuery = z.output<typeof reservationListQuerySchema>;
