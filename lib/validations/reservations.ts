import { z } from "zod";
import { SPECIES } from "@/lib/catalog";
import { isCurrencyCode, minorDigits, toMinor } from "@/lib/money/money";

// Shared by the batch and reservation forms (react-hook-form's zod resolver) and the route handlers that parse
// the same bodies. Numbers may arrive as typed text ("1,50") from a form or as JSON numbers from the API.

export const BATCH_DELIVERY = ["pickup", "delivery", "both"] as const;
export const HANDOVER_METHODS = ["pickup", "delivery"] as const;
export const BATCH_ACTIONS = ["pause", "resume", "close"] as const;

function numberFrom(label: string) {
  return z.union([z.number(), z.string().trim().min(1, `Enter ${label}`)]).transform((value, ctx) => {
    const n = typeof value === "number" ? value : Number(value.replace(",", "."));
    if (!Number.isFinite(n)) {
      ctx.addIssue({ code: "custom", message: `${label[0]?.toUpperCase() ?? ""}${label.slice(1)} must be a number` });
      return z.NEVER;
    }
    return n;
  });
}

const wholeNumber = (label: string, min: number, max: number) =>
  numberFrom(label).pipe(
    z
      .number()
      .int(`Whole ${label.replace(/^the /, "")} only`)
      .min(min, `At least ${min.toLocaleString("en")}`)
      .max(max, `At most ${max.toLocaleString("en")}`),
  );

const isoDate = (label: string) =>
  z
    .string({ error: `Choose ${label}` })
    .regex(/^\d{4}-\d{2}-\d{2}$/, `Choose ${label}`)
    .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)), `Choose ${label}`);

export const batchFormSchema = z
  .object({
    species: z.enum(SPECIES, { error: "Choose a species" }),
    // Fingerlings are sold from about 1 g; a 500 g fish is no longer a fingerling (common practice).
    meanWeightG: numberFrom("the mean weight").pipe(z.number().gt(0, "More than 0 g").max(500, "At most 500 g")),
    meanLengthCm: numberFrom("the mean length").pipe(z.number().gt(0, "More than 0 cm").max(40, "At most 40 cm")),
    countAvailable: wholeNumber("fish", 1, 1_000_000),
    pricePerFish: numberFrom("the price").pipe(z.number().gt(0, "More than 0").max(10_000, "At most 10,000 per fish")),
    currency: z.string().refine(isCurrencyCode, "Use an ISO 4217 currency code such as ZMW"),
    readyFrom: isoDate("the date the fish are ready"),
    sellBy: isoDate("the last day you sell this batch"),
    delivery: z.enum(BATCH_DELIVERY, { error: "Choose how buyers get the fish" }),
  })
  .superRefine((v, ctx) => {
    if (v.sellBy < v.readyFrom) ctx.addIssue({ code: "custom", path: ["sellBy"], message: "The last day must be on or after the ready date" });
    const digits = minorDigits(v.currency);
    if (Math.abs(v.pricePerFish * 10 ** digits - Math.round(v.pricePerFish * 10 ** digits)) > 1e-6) {
      ctx.addIssue({ code: "custom", path: ["pricePerFish"], message: digits === 0 ? `${v.currency} has no smaller unit: use a whole number` : `At most ${digits} decimal places` });
    }
  })
  .transform((v) => ({ ...v, priceMinor: toMinor(v.pricePerFish, v.currency) }));

export type BatchFormInput = z.input<typeof batchFormSchema>;
export type BatchFormValues = z.output<typeof batchFormSchema>;

export const batchActionSchema = z.object({ action: z.enum(BATCH_ACTIONS, { error: "Choose pause, resume or close" }) });

export const reserveSchema = z.object({
  batchId: z.string().min(1, "Choose a batch").max(100),
  count: wholeNumber("fish", 1, 1_000_000),
  handoverMethod: z.enum(HANDOVER_METHODS, { error: "Choose collection or delivery" }),
  note: z.string().trim().max(500, "At most 500 characters").optional(),
});
export type ReserveInput = z.input<typeof reserveSchema>;
export type ReserveValues = z.output<typeof reserveSchema>;

/** The stand-in's test cards (docs.stripe.com/testing); a live deployment gets a token from the card form instead. */
export const TEST_PAYMENT_METHODS = [
  { id: "pm_card_visa", label: "Test card that pays (Visa ending 4242)" },
  { id: "pm_card_chargeDeclined", label: "Test card that is declined (ending 0002)" },
  { id: "pm_card_chargeDeclinedInsufficientFunds", label: "Test card with too little money (ending 9995)" },
] as const;

export const paySchema = z.object({
  paymentMethod: z
    .string({ error: "Choose how to pay" })
    .regex(/^pm_[A-Za-z0-9_]{1,80}$/, "Choose how to pay"),
});
export type PayInput = z.infer<typeof paySchema>;

export const QUARANTINE_ITEMS = ["hapa", "acclimatise", "watch", "remove_dead", "treat", "release"] as const;

const reason = (min: number, what: string) => z.string().trim().min(min, `Say in a few words ${what}`).max(1000, "At most 1000 characters");

export const handOverSchema = z.object({ action: z.literal("hand_over"), count: wholeNumber("fish", 1, 1_000_000) });
export const survivalSchema = z.object({ action: z.literal("report_survival"), survived: wholeNumber("fish", 0, 1_000_000) });
export const disputeSchema = z.object({ action: z.literal("dispute"), reason: reason(10, "what went wrong") });
export type HandOverInput = z.input<typeof handOverSchema>;
export type SurvivalInput = z.input<typeof survivalSchema>;
export type DisputeInput = z.input<typeof disputeSchema>;

export const reservationActionSchema = z.discriminatedUnion("action", [
  z.object({ action: z.literal("accept") }),
  z.object({ action: z.literal("decline"), reason: z.string().trim().max(500).optional() }),
  z.object({ action: z.literal("cancel"), reason: z.string().trim().max(500).optional() }),
  handOverSchema,
  survivalSchema,
  disputeSchema,
  z.object({ action: z.literal("resolve_dispute"), outcome: z.enum(["for_farmer", "for_provider"]), note: z.string().trim().max(2000, "Keep the note under 2000 characters").optional() }),
  z.object({ action: z.literal("refund") }),
  z.object({ action: z.literal("check"), item: z.enum(QUARANTINE_ITEMS), done: z.boolean() }),
]);
export type ReservationActionInput = z.input<typeof reservationActionSchema>;
export type ReservationAction = z.output<typeof reservationActionSchema>;

// "attention": what needs the viewer first (a deposit to pay, a survival report due), then the rest, newest first.
export const RESERVATION_SORTS = ["requestedAt", "count", "state", "total", "attention"] as const;
export const RESERVATION_FILTERS = ["all", "open", "requested", "accepted", "deposit_held", "quarantine", "disputed", "done"] as const;

export const reservationListQuerySchema = z.object({
  as: z.enum(["farmer", "hatchery"]).default("farmer"),
  state: z.enum(RESERVATION_FILTERS).default("all"),
  batchId: z.string().max(100).optional(),
  q: z.string().trim().max(100).optional(),
  sort: z.enum(RESERVATION_SORTS).default("requestedAt"),
  dir: z.enum(["asc", "desc"]).default("desc"),
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  pageSize: z.coerce.number().int().min(5).max(100).default(10),
});
export type ReservationListQuery = z.output<typeof reservationListQuerySchema>;
