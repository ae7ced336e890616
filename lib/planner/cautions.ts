import type { TankType } from "@/lib/validations/planner";

/* Safety notes shown beside the figures. They do not change any number; they say what a figure means for the build. */

export type CautionCode = "children-deep-water" | "electric-pump-near-water" | "base-must-carry-water";

export interface PlanCaution {
  code: CautionCode;
  message: string;
}

export interface CautionContext {
  tankType: TankType;
  waterDepthM: number;
  pumpHeadM: number;
  pumpedM3: number;
  waterMassTonnes: number;
  basePressureKPa: number;
}

export function planCautions(ctx: CautionContext): PlanCaution[] {
  const out: PlanCaution[] = [
    {
      code: "children-deep-water",
      message: `${ctx.waterDepthM.toFixed(2)} m of water can drown a child: fence the tank and keep it covered when no one is there.`,
    },
  ];
  if (ctx.pumpHeadM > 0 && ctx.pumpedM3 > 0) {
    out.push({
      code: "electric-pump-near-water",
      message: "An electric pump near water needs a residual-current device (RCD) on its circuit, and wiring by a qualified electrician.",
    });
  }
  if (ctx.tankType !== "earthen") {
    out.push({
      code: "base-must-carry-water",
      message: `Full, this tank holds ${ctx.waterMassTonnes.toFixed(1)} t of water, pressing ${ctx.basePressureKPa.toFixed(1)} kPa on its base: build on a level slab or a compacted base that carries it, and follow a qualified builder and local codes for the frame and base.`,
    });
  }
  return out;
}
