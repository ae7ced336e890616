import { z } from "zod";
import type { TankType } from "@/lib/catalog";
import { ALWAYS, dateFromIso, isoDate, pointFields, readPoint, readTankSize, report, tankSizeFields, type FieldIssue, type TankSize } from "./tank-size";

/*
 * A finished tank a builder adds by hand. The exact point typed here is rounded before it is stored
 * (lib/portfolio/portfolio-service.ts), so the form may take a real site.
 */

export type PortfolioItemInput = {
  /** handed out by the page, so photos uploaded before saving already name the item */
  id: string;
  tankType: TankType;
  size: TankSize;
  place: { lat: number; lng: number };
  placeName: string;
  completedOn: Date;
  caption: string;
};

function completedOnIssues(v: { completedOn?: unknown }): FieldIssue[] {
  if (typeof v.completedOn !== "string" || !/^\d{4}-\d{2}-\d{2}$/.test(v.completedOn)) return [];
  const day = dateFromIso(v.completedOn).getTime();
  if (day > Date.now() + 24 * 60 * 60 * 1000) return [{ path: "completedOn", message: "A finished tank has a date in the past" }];
  if (day < Date.UTC(1970, 0, 1)) return [{ path: "completedOn", message: "Choose a date after 1970" }];
  return [];
}

export const portfolioItemFormSchema = z
  .object({
    id: z.uuid({ error: "This form has expired: reload the page" }),
    ...tankSizeFields,
    ...pointFields,
    placeName: z.string().trim().min(2, "Name the town or area, e.g. Chongwe").max(80, "Keep it under 80 characters"),
    completedOn: isoDate,
    caption: z.string().trim().max(300, "Keep the caption under 300 characters"),
  })
  .superRefine((v, ctx) => {
    // With ALWAYS this also runs when the body was not an object at all.
    if (typeof v !== "object" || v === null) return;
    report(ctx, [...readTankSize(v).issues, ...readPoint(v).issues, ...completedOnIssues(v)]);
  }, ALWAYS)
  .transform((v): PortfolioItemInput => {
    const { size } = readTankSize(v);
    const { point } = readPoint(v);
    if (!size || !point) throw new Error("unreachable: checked above");
    return { id: v.id, tankType: v.tankType, size, place: point, placeName: v.placeName, completedOn: dateFromIso(v.completedOn), caption: v.caption };
  });

export type PortfolioItemForm = z.input<typeof portfolioItemFormSchema>;
