import { z } from "zod";
import { parseDecimal } from "./tank-size";

/*
 * A builder's quote as typed: lines of materials, labour or other work (travel is computed by the server from the
 * distance, never typed), and whether the farmer supplies the materials. Amounts are decimal strings in the
 * builder's currency; the service turns them into minor units with that currency's ISO 4217 exponent.
 * The quote form uses this schema through react-hook-form's resolver and sends the same strings.
 */

export const TYPED_LINE_KINDS = ["materials", "labour", "other"] as const;
export type TypedLineKind = (typeof TYPED_LINE_KINDS)[number];

export const QUOTE_SCOPES = ["turnkey", "farmer_supplies_materials"] as const;
export type QuoteScope = (typeof QUOTE_SCOPES)[number];

// A quantity is priced to 4 decimals (lib/jobs/quote.ts); more would be silently rounded, so it is refused.
const QUANTITY = /^\d+(?:[.,]\d{1,4})?$/;
// Up to 3 decimals: the most any ISO 4217 currency has (BHD, KWD…); the service checks the builder's currency.
const AMOUNT = /^\d+(?:[.,]\d{1,3})?$/;

export const MAX_QUOTE_LINES = 30;

export const quoteLineFormSchema = z.object({
  kind: z.enum(TYPED_LINE_KINDS, { error: "Choose materials, labour or other" }),
  description: z.string().trim().min(1, "Say what this line is for").max(200, "Keep it under 200 characters"),
  quantity: z
    .string()
    .trim()
    .regex(QUANTITY, "Quantity must be a number with at most 4 decimals")
    .refine((s) => parseDecimal(s) > 0 && parseDecimal(s) <= 100_000, "Quantity must be more than 0 and at most 100 000"),
  unitPrice: z
    .string()
    .trim()
    .regex(AMOUNT, "Price must be an amount such as 450 or 450.50")
    .refine((s) => parseDecimal(s) <= 10_000_000, "Price is too large"),
});

export const quoteFormSchema = z
  .object({
    scope: z.enum(QUOTE_SCOPES, { error: "Choose turnkey or farmer supplies materials" }),
    note: z.string().trim().max(1000, "Keep the note under 1000 characters"),
    lines: z.array(quoteLineFormSchema).min(1, "Add at least one line").max(MAX_QUOTE_LINES, `At most ${MAX_QUOTE_LINES} lines`),
  })
  .refine((v) => v.scope !== "farmer_supplies_materials" || v.lines.some((l) => l.kind !== "materials"), {
    path: ["lines"],
    message: "When the farmer supplies the materials, add at least one labour or other line",
  });

export type QuoteForm = z.input<typeof quoteFormSchema>;
export type QuoteFormOutput = z.output<typeof quoteFormSchema>;

/** Accepting names the version the farmer looked at (see lib/quotes/quote-service.ts acceptQuote). */
export const acceptQuoteSchema = z.object({ version: z.number({ error: "Reload the page and accept again" }).int().positive() });
