import { z } from "zod";

/* What a farmer, builder or admin may ask of a job. Photos are counted by the server, never taken from the client. */

export const jobActionSchema = z.discriminatedUnion(
  "type",
  [
    z.object({ type: z.literal("arrive") }),
    z.object({ type: z.literal("mark_built") }),
    z.object({ type: z.literal("confirm") }),
    z.object({
      type: z.literal("dispute"),
      reason: z.string().trim().min(10, "Say in a sentence or two what is wrong (at least 10 characters)").max(2000, "Keep it under 2000 characters"),
    }),
    z.object({ type: z.literal("cancel"), reason: z.string().trim().max(1000, "Keep it under 1000 characters").default("") }),
    z.object({
      type: z.literal("resolve"),
      outcome: z.enum(["for_farmer", "for_builder", "split"]),
      releaseMinor: z.number().int().positive().optional(),
      note: z.string().trim().max(2000).default(""),
    }),
  ],
  { error: "Unknown action" },
);
export type JobAction = z.infer<typeof jobActionSchema>;

/** A card or wallet token from the payment page (for the card processor: a PaymentMethod id). */
export const depositSchema = z.object({
  paymentMethod: z.string().regex(/^pm_[A-Za-z0-9_]{1,100}$/, "Choose how to pay"),
});
export type DepositInput = z.infer<typeof depositSchema>;
