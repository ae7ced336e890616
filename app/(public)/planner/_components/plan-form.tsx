"use client";
import type { ReactNode } from "react";
import { describedBy, Field, Input } from "@/components/ui/field";
import { fixed, money, num } from "@/components/planner/format";
import { LINER_LABEL, SPECIES_LABEL, SUN_LABEL, TANK_SHAPE_LABEL, TANK_TYPE_LABEL, TANK_TYPE_NOTE } from "@/components/planner/labels";
import { INPUT_DEFAULT_SOURCES } from "@/lib/planner/assumptions";
import { BUILD_COST_MODEL_CURRENCY, DEFAULT_TANK_LIFE_YEARS, modelBuildCostMinor } from "@/lib/planner/costs";
import type { PlanEstimate } from "@/lib/planner/plan-estimate";
import { numberFieldSpec, shownUnit, type NumberFieldPath } from "@/lib/plans/draft-fields";
import { inputToDraft, withLengthUnit, type PlanDraft } from "@/lib/plans/plan-draft";
import {
  DEFAULT_WATER_CHANGE,
  defaultPlanInput,
  LINER_COLOURS,
  SPECIES_CHOICES,
  SUN_EXPOSURES,
  TANK_SHAPES,
  TANK_TYPES,
  type PlanInput,
  type TankType,
} from "@/lib/validations/planner";
import { RadioCards, SelectField } from "./choice-field";
import { NumberField } from "./number-field";

export interface PlanFormProps {
  draft: PlanDraft;
  errors: Record<string, string>;
  /** The last input that parsed: the source of the figures the form quotes (capacity, build-cost estimate). */
  shownInput: PlanInput;
  estimate: PlanEstimate;
  currencySymbol: string;
  onNumber: (path: NumberFieldPath, text: string) => void;
  onDraft: (change: (draft: PlanDraft) => PlanDraft) => void;
}

function sourceKey(path: string): string {
  if (path.startsWith("tank.dimensions.")) return "tank.dimensions";
  if (path.startsWith("waterChange.")) return "waterChange";
  return path;
}

function Group({ title, children, id }: { title: string; children: ReactNode; id: string }) {
  return (
    <section aria-labelledby={id} className="rounded-card border border-silt-200 bg-white p-4 shadow-card sm:p-5">
      <h2 id={id} className="text-lg font-semibold text-silt-950">
        {title}
      </h2>
      <div className="mt-4 space-y-3">{children}</div>
    </section>
  );
}

/** The default plan for a tank type: the water-change schedule depends on it (no soil → a full change every week). */
function defaultsFor(type: TankType): PlanInput {
  return { ...defaultPlanInput, waterChange: { ...DEFAULT_WATER_CHANGE[type] } };
}

export function PlanForm({ draft, errors, shownInput, estimate, currencySymbol, onNumber, onDraft }: PlanFormProps) {
  const defaults = inputToDraft(defaultsFor(draft.tankType), draft.lengthUnit);
  // The demo defaults are ZMW prices, whatever currency is typed.
  const defaultMoney = (text: string) => `K${fixed(Number(text), 2)}`;

  const field = (path: NumberFieldPath, extra: { defaultWords?: string; placeholder?: string; defaultText?: string | null } = {}) => {
    const spec = numberFieldSpec(path);
    const unit = shownUnit(spec, draft, currencySymbol);
    const defaultText = extra.defaultText !== undefined ? extra.defaultText : defaults.numbers[path];
    const words = extra.defaultWords ?? (spec.kind === "money" && defaultText ? defaultMoney(defaultText) : `${defaultText}${unit ? ` ${unit}` : ""}`);
    return (
      <NumberField
        key={path}
        path={path}
        label={spec.label}
        unit={unit}
        value={draft.numbers[path]}
        onChange={(text) => onNumber(path, text)}
        error={errors[path]}
        defaultText={defaultText}
        defaultWords={words}
        source={INPUT_DEFAULT_SOURCES[sourceKey(path)]}
        placeholder={extra.placeholder}
      />
    );
  };

  const setTankType = (type: TankType) =>
    onDraft((d) => {
      // A schedule still at the old type's default follows the new type's; one the person typed is kept.
      const before = inputToDraft(defaultsFor(d.tankType), d.lengthUnit).numbers;
      const after = inputToDraft(defaultsFor(type), d.lengthUnit).numbers;
      const numbers = { ...d.numbers };
      for (const p of ["waterChange.intervalDays", "waterChange.fractionExchanged"] as const) if (numbers[p].trim() === before[p]) numbers[p] = after[p];
      return { ...d, tankType: type, numbers };
    });

  const inTank = draft.species === "both" ? (["tilapia", "catfish"] as const) : ([draft.species] as const);
  const t = shownInput.tank;
  const modelCost = shownInput.currency === BUILD_COST_MODEL_CURRENCY ? modelBuildCostMinor(t.type, t.dimensions, t.waterDepthM + t.freeboardM) : null;

  return (
    <div className="space-y-4">
      <Group title="Your tank" id="form-tank">
        <RadioCards
          name="tankType"
          legend="Tank type"
          choices={TANK_TYPES.map((v) => ({ value: v, label: TANK_TYPE_LABEL[v], note: TANK_TYPE_NOTE[v] }))}
          value={draft.tankType}
          onChange={setTankType}
          columns="grid-cols-1 sm:grid-cols-3 lg:grid-cols-1"
        />
        <div className="grid gap-5 sm:grid-cols-2 lg:grid-cols-1">
          <RadioCards name="shape" legend="Shape" choices={TANK_SHAPES.map((v) => ({ value: v, label: TANK_SHAPE_LABEL[v] }))} value={draft.shape} onChange={(shape) => onDraft((d) => ({ ...d, shape }))} columns="grid-cols-2" />
          <RadioCards
            name="lengthUnit"
            legend="Measure in"
            choices={[
              { value: "m", label: "Metres" },
              { value: "ft", label: "Feet" },
            ]}
            value={draft.lengthUnit}
            onChange={(unit) => onDraft((d) => withLengthUnit(d, unit))}
            columns="grid-cols-2"
          />
        </div>
        <p className="text-xs text-silt-600">Inside measurements of the tank. 1 ft = 0.3048 m exactly; a 10 ft × 6 ft tank is a common small size.</p>
        <div className="grid grid-cols-2 gap-x-4">
          {draft.shape === "rectangular" ? (
            <>
              {field("tank.dimensions.lengthM")}
              {field("tank.dimensions.widthM")}
            </>
          ) : (
            <div className="col-span-2 row-span-3 grid grid-rows-subgrid">{field("tank.dimensions.diameterM")}</div>
          )}
          {field("tank.waterDepthM")}
          {field("tank.freeboardM")}
        </div>
        {draft.tankType === "tarpaulin" ? (
          <SelectField id="f-linerColour" label="Liner colour" choices={LINER_COLOURS.map((v) => ({ value: v, label: LINER_LABEL[v] }))} value={draft.linerColour} onChange={(linerColour) => onDraft((d) => ({ ...d, linerColour }))} />
        ) : null}
        <SelectField id="f-sunExposure" label="Sun on the tank" choices={SUN_EXPOSURES.map((v) => ({ value: v, label: SUN_LABEL[v] }))} value={draft.sunExposure} onChange={(sunExposure) => onDraft((d) => ({ ...d, sunExposure }))} />
        {field("tank.buildCostOverrideMinor", {
          defaultText: null,
          defaultWords: modelCost === null ? "none: the planner has no build prices in this currency, enter a builder's quote" : `empty: the planner's estimate, ${money(modelCost, shownInput.currency)}`,
          placeholder: modelCost === null ? "a builder's quote" : `estimate ${money(modelCost, shownInput.currency)}`,
        })}
        {field("tank.lifeYears", { defaultText: null, defaultWords: `empty: ${DEFAULT_TANK_LIFE_YEARS[draft.tankType]} years for this type`, placeholder: `${DEFAULT_TANK_LIFE_YEARS[draft.tankType]}` })}
      </Group>

      <Group title="Your fish" id="form-fish">
        <RadioCards name="species" legend="Species" choices={SPECIES_CHOICES.map((v) => ({ value: v, label: SPECIES_LABEL[v] }))} value={draft.species} onChange={(species) => onDraft((d) => ({ ...d, species }))} columns="grid-cols-1 sm:grid-cols-3 lg:grid-cols-1" />
        {draft.species === "both" ? field("tilapiaShareOfFishFraction") : null}
        {inTank.map((s) => (
          <fieldset key={s} className="rounded-lg border border-silt-200 p-3">
            <legend className="px-1 text-sm font-semibold text-silt-900">{s === "tilapia" ? "Nile tilapia" : "African catfish"}</legend>
            <div className="grid grid-cols-2 gap-x-4">
              {field(`${s}.stockingWeightG`)}
              {field(`${s}.targetHarvestWeightG`)}
              {field(`${s}.fingerlingPriceMinor`)}
              {field(`${s}.salePricePerKgMinor`)}
              <div className="col-span-2 row-span-3 grid grid-rows-subgrid">{field(`${s}.fcr`)}</div>
            </div>
          </fieldset>
        ))}
        {field("fishToStock", {
          defaultText: null,
          defaultWords: `empty: as many as the tank carries to harvest, ${num(estimate.stocking.capacityFish)} now`,
          placeholder: `${estimate.stocking.capacityFish}`,
        })}
        <div className="grid grid-cols-2 gap-x-4">
          {field("quarantineSurvivalFraction")}
          {field("growOutSurvivalFraction")}
        </div>
        {field("waterTemperatureC")}
        {inTank.some((s) => s === "catfish") ? (
          <label className="flex min-h-11 items-center gap-2">
            <input type="checkbox" checked={draft.catfishShadeProvided} onChange={(e) => onDraft((d) => ({ ...d, catfishShadeProvided: e.target.checked }))} className="h-5 w-5 accent-lagoon-600" />
            <span className="text-sm font-medium text-silt-800">Part of the tank is shaded or covered for the catfish</span>
          </label>
        ) : null}
      </Group>

      <Group title="Feed, water and power" id="form-running">
        {field("feedPricePerKgMinor")}
        <div className="grid grid-cols-2 gap-x-4">
          {field("waterChange.intervalDays")}
          {field("waterChange.fractionExchanged")}
        </div>
        <div className="grid grid-cols-2 gap-x-4">
          {field("pump.headM")}
          {field("pump.efficiencyFraction")}
        </div>
        {field("pump.electricityTariffPerKWhMinor")}
        {field("labourCostPerCycleMinor")}
        <Field id="f-currency" label="Currency (ISO 4217 code)" hint="Prices are typed in this currency's main unit, such as kwacha (K) for ZMW." error={errors.currency}>
          <Input
            id="f-currency"
            value={draft.currency}
            maxLength={3}
            autoComplete="off"
            autoCapitalize="characters"
            onChange={(e) => onDraft((d) => ({ ...d, currency: e.target.value.toUpperCase() }))}
            aria-invalid={Boolean(errors.currency)}
            aria-describedby={describedBy("f-currency", errors.currency, true)}
          />
        </Field>
      </Group>
    </div>
  );
}
