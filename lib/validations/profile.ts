import * as z from "zod/mini";
import { SELF_SERVICE_ROLES } from "@/lib/auth/permissions";

/*
 * Written with zod/mini, the tree-shakable form of zod 4: the sign-in, sign-up, password and onboarding forms load
 * these schemas in the browser (react-hook-form's zodResolver), and all of zod would be about 31 KB gzipped of every
 * such page's first load; these rules cost about 5 KB. The server parses the same schema objects with zod, so
 * browser and server apply one set of rules. zod/mini ships no locale, so every rule carries its own message (the
 * browser would otherwise say "Invalid input" where the server says something else).
 */

/** Strips the spaces, dashes, dots and brackets people type, then checks ITU-T E.164: + and up to 15 digits. */
export const phoneSchema = z.pipe(
  z.pipe(
    z.string().check(z.trim()),
    z.transform((s: string) => s.replace(/[\s().-]/g, "")),
  ),
  z.string().check(z.regex(/^\+[1-9]\d{7,14}$/, "Use international form: + then country code and number, e.g. +260 97 123 4567")),
);

export const latitudeSchema = z.number({ error: "Latitude must be a number" }).check(z.gte(-90, "Latitude is between -90 and 90"), z.lte(90, "Latitude is between -90 and 90"));
export const longitudeSchema = z.number({ error: "Longitude must be a number" }).check(z.gte(-180, "Longitude is between -180 and 180"), z.lte(180, "Longitude is between -180 and 180"));

const displayName = z.string({ error: "Enter a name" }).check(z.trim(), z.minLength(2, "Name is at least 2 characters"), z.maxLength(80, "Name is at most 80 characters"));
const region = z.string({ error: "Enter a region" }).check(z.trim(), z.minLength(2, "Region is at least 2 characters"), z.maxLength(60, "Region is at most 60 characters"));

export const onboardingSchema = z
  .object({
    roles: z.array(z.enum(SELF_SERVICE_ROLES, { error: "Choose farmer, hatchery or builder" }), { error: "Choose at least one" }).check(z.minLength(1, "Choose at least one"), z.maxLength(3, "Choose at most three")),
    displayName,
    region,
    phone: z.optional(z.union([z.literal(""), phoneSchema], { error: "Use international form: + then country code and number, e.g. +260 97 123 4567" })),
    lat: z.optional(latitudeSchema),
    lng: z.optional(longitudeSchema),
    about: z.optional(z.string({ error: "Write a few words about yourself" }).check(z.trim(), z.maxLength(1000, "At most 1000 characters"))),
  })
  .check(
    z.superRefine((v, ctx) => {
      const provider = v.roles.includes("hatchery") || v.roles.includes("builder");
      if (provider && !v.phone) ctx.addIssue({ code: "custom", path: ["phone"], message: "Hatcheries and builders need a phone number buyers can call" });
      if (provider && (v.lat === undefined || v.lng === undefined)) {
        ctx.addIssue({ code: "custom", path: ["lat"], message: "Pick your location on the map or type its coordinates" });
      }
      if ((v.lat === undefined) !== (v.lng === undefined)) ctx.addIssue({ code: "custom", path: ["lng"], message: "Give both latitude and longitude" });
    }),
  );

export type OnboardingInput = z.input<typeof onboardingSchema>;
export type OnboardingData = z.output<typeof onboardingSchema>;

const email = z.email("Enter a valid e-mail address");
const newPassword = z.string({ error: "Use at least 10 characters" }).check(z.minLength(10, "Use at least 10 characters"), z.maxLength(128, "At most 128 characters"));

/** What the server checks on a sign-up request (the confirm field stays in the browser). */
export const signUpServerSchema = z.object({
  name: displayName,
  // RFC 5321 §4.5.3.1.3: a path (and so an address) is at most 256 octets including its angle brackets.
  email: email.check(z.maxLength(254, "An e-mail address is at most 254 characters")),
  password: newPassword,
});

export const signUpSchema = z
  .extend(signUpServerSchema, { confirm: z.string({ error: "The two passwords differ" }) })
  .check(z.refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two passwords differ" }));

export const signInSchema = z.object({
  email,
  password: z.string({ error: "Enter your password" }).check(z.minLength(1, "Enter your password")),
});

export const forgotPasswordSchema = z.object({ email });

export const resetPasswordSchema = z
  .object({
    password: newPassword,
    confirm: z.string({ error: "The two passwords differ" }),
  })
  .check(z.refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two passwords differ" }));

/** Regions of the demo country, offered as suggestions; any region name is accepted. */
export const SUGGESTED_REGIONS = [
  "Central",
  "Copperbelt",
  "Eastern",
  "Luapula",
  "Lusaka",
  "Muchinga",
  "Northern",
  "North-Western",
  "Southern",
  "Western",
] as const;
