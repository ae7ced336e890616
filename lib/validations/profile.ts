import { z } from "zod";
import { SELF_SERVICE_ROLES } from "@/lib/auth/permissions";

/** Strips the spaces, dashes, dots and brackets people type, then checks ITU-T E.164: + and up to 15 digits. */
export const phoneSchema = z
  .string()
  .trim()
  .transform((s) => s.replace(/[\s().-]/g, ""))
  .pipe(z.string().regex(/^\+[1-9]\d{7,14}$/, "Use international form: + then country code and number, e.g. +260 97 123 4567"));

export const latitudeSchema = z.number({ error: "Latitude must be a number" }).min(-90, "Latitude is between -90 and 90").max(90, "Latitude is between -90 and 90");
export const longitudeSchema = z.number({ error: "Longitude must be a number" }).min(-180, "Longitude is between -180 and 180").max(180, "Longitude is between -180 and 180");

const displayName = z.string().trim().min(2, "Name is at least 2 characters").max(80, "Name is at most 80 characters");
const region = z.string().trim().min(2, "Region is at least 2 characters").max(60, "Region is at most 60 characters");

export const onboardingSchema = z
  .object({
    roles: z.array(z.enum(SELF_SERVICE_ROLES)).min(1, "Choose at least one").max(3),
    displayName,
    region,
    phone: z.union([z.literal(""), phoneSchema]).optional(),
    lat: latitudeSchema.optional(),
    lng: longitudeSchema.optional(),
    about: z.string().trim().max(1000, "At most 1000 characters").optional(),
  })
  .superRefine((v, ctx) => {
    const provider = v.roles.includes("hatchery") || v.roles.includes("builder");
    if (provider && !v.phone) ctx.addIssue({ code: "custom", path: ["phone"], message: "Hatcheries and builders need a phone number buyers can call" });
    if (provider && (v.lat === undefined || v.lng === undefined)) {
      ctx.addIssue({ code: "custom", path: ["lat"], message: "Pick your location on the map or type its coordinates" });
    }
    if ((v.lat === undefined) !== (v.lng === undefined)) ctx.addIssue({ code: "custom", path: ["lng"], message: "Give both latitude and longitude" });
  });

export type OnboardingInput = z.input<typeof onboardingSchema>;
export type OnboardingData = z.output<typeof onboardingSchema>;

/** What the server checks on a sign-up request (the confirm field stays in the browser). */
export const signUpServerSchema = z.object({
  name: displayName,
  email: z.email("Enter a valid e-mail address").max(254),
  password: z.string().min(10, "Use at least 10 characters").max(128, "At most 128 characters"),
});

export const signUpSchema = signUpServerSchema
  .extend({ confirm: z.string() })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two passwords differ" });

export const signInSchema = z.object({
  email: z.email("Enter a valid e-mail address"),
  password: z.string().min(1, "Enter your password"),
});

export const forgotPasswordSchema = z.object({ email: z.email("Enter a valid e-mail address") });

export const resetPasswordSchema = z
  .object({
    password: z.string().min(10, "Use at least 10 characters").max(128, "At most 128 characters"),
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two passwords differ" });

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
