import { z } from "zod";
import type { TankType } from "@/lib/catalog";
import { POWER_SOURCES, SITE_READINESS, WATER_SOURCES, type PowerSource, type SiteReadiness, type WaterSource } from "@/lib/jobs/vocabulary";
import { ALWAYS, DAY_MS, dateFromIso, isoDate, pointFields, readPoint, readTankSize, report, tankSizeFields, type FieldIssue, type TankSize } from "./tank-size";

/*
 * A farmer's tank request. The form (react-hook-form with this schema's resolver) holds strings as typed; the
 * browser sends those same strings, and POST /api/v1/tank-requests parses them with this schema again.
 */

export type TankRequestInput = {
  /** handed out by the new-request page, so site photos uploaded before posting already name the request */
  id: string;
  tankType: TankType;
  size: TankSize;
  site: { lat: number; lng: number };
  readiness: SiteReadiness;
  waterSource: WaterSource;
  power: PowerSource;
  wantedBy: Date;
  planId: string | null;
  notes: string;
};

const tankRequestFields = z.object({
  id: z.uuid({ error: "This form has expired: reload the page" }),
  ...tankSizeFields,
  ...pointFields,
  readiness: z.enum(SITE_READINESS, { error: "Say what the ground at the site is like" }),
  waterSource: z.enum(WATER_SOURCES, { error: "Say where water will come from" }),
  power: z.enum(POWER_SOURCES, { error: "Say whether there is power at the site" }),
  wantedBy: isoDate,
  planId: z.union([z.uuid(), z.literal("")], { error: "Choose one of your saved plans" }),
  notes: z.string().trim().max(1000, "Keep the notes under 1000 characters"),
});

function wantedByIssues(v: { wantedBy?: unknown }): FieldIssue[] {
  if (typeof v.wantedBy !== "string" || !/^\d{4}-\d{2}-\d{2}$/.test(v.wantedBy)) return [];
  // A day of slack: "today" in the farmer's time zone may still be yesterday in UTC.
  return dateFromIso(v.wantedBy).getTime() < Date.now() - DAY_MS ? [{ path: "wantedBy", message: "Choose today or a later date" }] : [];
}

export const tankRequestFormSchema = tankRequestFields
  .superRefine((v, ctx) => {
    // With ALWAYS this also runs when the body was not an object at all.
    if (typeof v !== "object" || v === null) return;
    report(ctx, [...readTankSize(v).issues, ...readPoint(v).issues, ...wantedByIssues(v)]);
  }, ALWAYS)
  .transform((v): TankRequestInput => {
    const { size } = readTankSize(v);
    const { point } = readPoint(v);
    if (!size || !point) throw new Error("unreachable: checked above");
    return {
      id: v.id,
      tankType: v.tankType,
      size,
      site: point,
      readiness: v.readiness,
      waterSource: v.waterSource,
      power: v.power,
      wantedBy: dateFromIso(v.wantedBy),
      planId: v.planId === "" ? null : v.planId,
      notes: v.notes,
    };
  });

export type TankRequestForm = z.input<typeof tankRequestFormSchema>;
