import { readFileSync } from "node:fs";
import { zodResolver } from "@hookform/resolvers/zod";
import type { FieldValues, ResolverOptions } from "react-hook-form";
import { describe, expect, it } from "vitest";
import { safeParse, type z } from "zod";
import { Invalid } from "@/lib/errors";
import { forgotPasswordSchema, onboardingSchema, resetPasswordSchema, signInSchema, signUpSchema, signUpServerSchema } from "./profile";
import { defaultPlanInput, planInputSchema, savePlanSchema } from "./planner";
import { batchFormSchema, disputeSchema, handOverSchema, paySchema, reservationActionSchema, reservationListQuerySchema, reserveSchema, survivalSchema } from "./reservations";

/*
 * The form schemas browsers load are written with zod/mini, which carries no locale: a rule without its own message
 * would read "Invalid input" in the browser and something else on the server. These tests hold the two sides to
 * the same words.
 */

const cases: { name: string; schema: z.core.$ZodType; bad: unknown[] }[] = [
  { name: "sign-in", schema: signInSchema, bad: [{ email: "nope", password: "" }, { email: "", password: "x" }, {}] },
  { name: "sign-up", schema: signUpSchema, bad: [{ name: "A", email: "x@", password: "short", confirm: "other" }, { name: " ".repeat(3), email: `${"a".repeat(250)}@b.zm`, password: "p".repeat(129), confirm: "" }, {}] },
  { name: "sign-up (server)", schema: signUpServerSchema, bad: [{ name: 7, email: 7, password: 7 }] },
  { name: "forgot password", schema: forgotPasswordSchema, bad: [{ email: "" }, {}] },
  { name: "reset password", schema: resetPasswordSchema, bad: [{ password: "short", confirm: "x" }, {}] },
  {
    name: "onboarding",
    schema: onboardingSchema,
    bad: [
      { roles: [], displayName: "", region: "x", phone: "0971", lat: 100, lng: -200, about: "x".repeat(1001) },
      { roles: ["admin", "farmer", "builder", "hatchery"], displayName: "Kafue", region: "Lusaka", lat: "north" },
      { roles: ["builder"], displayName: "Kafue Tanks", region: "Lusaka" },
      {},
    ],
  },
  {
    name: "batch",
    schema: batchFormSchema,
    bad: [
      { species: "carp", meanWeightG: "", meanLengthCm: "abc", countAvailable: "12.5", pricePerFish: "0", currency: "ZZZ", readyFrom: "soon", sellBy: "2030-02-30x", delivery: "boat" },
      { species: "tilapia", meanWeightG: "501", meanLengthCm: "41", countAvailable: "0", pricePerFish: "1.505", currency: "ZMW", readyFrom: "2030-03-01", sellBy: "2030-02-01", delivery: "pickup" },
      { meanWeightG: true, countAvailable: null },
    ],
  },
  { name: "reserve", schema: reserveSchema, bad: [{ batchId: "", count: "2.5", handoverMethod: "boat", note: "x".repeat(501) }, { batchId: "b".repeat(101), count: "0" }, {}] },
  { name: "pay", schema: paySchema, bad: [{ paymentMethod: "visa" }, {}] },
  { name: "hand over", schema: handOverSchema, bad: [{ action: "hand_over", count: "abc" }, { action: "hand_over", count: "1000001" }] },
  { name: "survival", schema: survivalSchema, bad: [{ action: "report_survival", survived: "-1" }, { action: "report_survival", survived: "" }] },
  { name: "dispute", schema: disputeSchema, bad: [{ action: "dispute", reason: "short" }, { action: "dispute", reason: "x".repeat(1001) }] },
  {
    name: "reservation action (API)",
    schema: reservationActionSchema,
    bad: [{ action: "nope" }, { action: "check", item: "x", done: "yes" }, { action: "decline", reason: "x".repeat(501) }, { action: "resolve_dispute", outcome: "both", note: 3 }, {}],
  },
  {
    name: "planner (API)",
    schema: planInputSchema,
    bad: [
      {},
      { ...defaultPlanInput, currency: "zmw", species: "carp", fishToStock: 2.5, tank: { ...defaultPlanInput.tank, dimensions: { shape: "oval" }, waterDepthM: 9 } },
      { ...defaultPlanInput, tank: { ...defaultPlanInput.tank, dimensions: { shape: "round" } }, catfishShadeProvided: "no", tilapia: { ...defaultPlanInput.tilapia, targetHarvestWeightG: 5 } },
    ],
  },
  { name: "saved plan (API)", schema: savePlanSchema, bad: [{ name: "  ", input: defaultPlanInput }, { name: "x".repeat(121) }, "plan"] },
  { name: "reservation list query (API)", schema: reservationListQuerySchema, bad: [{ page: "0", pageSize: "abc", sort: "x", dir: "up", as: "admin", state: "gone", q: "q".repeat(101), batchId: 4 }] },
];

// lib/api/handler.ts reads the environment when it loads: give it the one variable without a default, then load it.
process.env.BETTER_AUTH_SECRET ??= "form-schemas-test-secret-of-32-characters";
const { fieldErrorsOf, parseWith } = await import("@/lib/api/handler");

const NO_OWN_MESSAGE = "no message of our own";

describe("form schemas speak their own words", () => {
  // zod 4 takes an issue's message from the schema or check that raised it before a per-parse error map, and that
  // before the global locale (zod.dev "Customizing errors", error precedence; from memory). So a per-parse map
  // shows exactly the issues that would fall through to a locale, which zod/mini in the browser does not have.
  for (const c of cases) {
    it(`${c.name}: every refusal has a message of ours`, () => {
      for (const input of c.bad) {
        const r = safeParse(c.schema, input, { error: () => NO_OWN_MESSAGE });
        expect(r.success, JSON.stringify(input)).toBe(false);
        expect(r.error?.issues.map((i) => i.message) ?? [], JSON.stringify(input)).not.toContain(NO_OWN_MESSAGE);
      }
    });
  }
});

const resolverOptions = { fields: {}, shouldUseNativeValidation: false } as unknown as ResolverOptions<FieldValues>;

/** The first message per dotted field path of react-hook-form's nested errors. */
function flatten(errors: Record<string, unknown>, prefix = ""): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, value] of Object.entries(errors)) {
    if (!value || typeof value !== "object") continue;
    const path = prefix ? `${prefix}.${key}` : key;
    const message = (value as { message?: unknown }).message;
    if (typeof message === "string") out[path] = message;
    else Object.assign(out, flatten(value as Record<string, unknown>, path));
  }
  return out;
}

describe("the browser's resolver and the server's parser agree", () => {
  // @hookform/resolvers' zodResolver is what the forms run in the browser; parseWith is what the route handlers run.
  for (const c of cases.filter((c) => !c.name.includes("(API)") && !c.name.includes("(server)"))) {
    it(`${c.name}: the same message per field`, async () => {
      for (const input of c.bad) {
        const browser = await zodResolver(c.schema as never)(input as FieldValues, undefined, resolverOptions);
        let server: Record<string, string> = {};
        try {
          parseWith(c.schema, input);
        } catch (e) {
          if (!(e instanceof Invalid)) throw e;
          server = Object.fromEntries(Object.entries(e.fieldErrors ?? {}).map(([k, v]) => [k, v[0] ?? ""]));
        }
        const fromBrowser = flatten(browser.errors as Record<string, unknown>);
        expect(Object.keys(fromBrowser).length, JSON.stringify(input)).toBeGreaterThan(0);
        for (const [path, message] of Object.entries(fromBrowser)) expect(server[path], `${c.name} ${path}`).toBe(message);
      }
    });
  }

  it("fieldErrorsOf lists every message of a field, first as the resolver shows it", () => {
    const parsed = signUpSchema.safeParse({ name: "A", email: "x", password: "short", confirm: "other" });
    expect(parsed.success).toBe(false);
    if (parsed.success) return;
    expect(fieldErrorsOf(parsed.error)).toMatchObject({ name: ["Name is at least 2 characters"], email: ["Enter a valid e-mail address"], password: ["Use at least 10 characters"] });
  });
});

describe("browser-loaded schema modules stay off full zod", () => {
  // Importing all of zod ("zod") in one of them would add about 31 KB gzipped to every page that loads it.
  const files = ["lib/validations/profile.ts", "lib/validations/reservations.ts", "lib/validations/planner.ts", "lib/plans/plan-draft.ts", "lib/plans/draft-fields.ts", "app/(public)/planner/_components/draft-storage.ts"];
  for (const file of files) {
    it(`${file} imports zod/mini or zod's core only`, () => {
      const source = readFileSync(file, "utf8");
      const imports = [...source.matchAll(/^import (?!type )[^;]*from "(zod[^"]*)"/gm)].map((m) => m[1]);
      expect(imports.length).toBeGreaterThan(0);
      for (const from of imports) expect(["zod/mini", "zod/v4/core"]).toContain(from);
    });
  }
});
