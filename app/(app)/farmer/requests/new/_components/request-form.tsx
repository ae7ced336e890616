"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, type FieldPath } from "react-hook-form";
import { PointFields } from "@/components/jobs/point-fields";
import { TankSizeFields } from "@/components/jobs/tank-size-fields";
import { ImageUploader } from "@/components/upload/image-uploader";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { describedBy, Field, FormError, inputClass } from "@/components/ui/field";
import { postJson } from "@/lib/api/client";
import { fullVolumeM3, storedSizeOf } from "@/lib/requests/format";
import { POWER_SOURCE_LABEL, POWER_SOURCES, SITE_READINESS, SITE_READINESS_LABEL, WATER_SOURCE_LABEL, WATER_SOURCES } from "@/lib/jobs/vocabulary";
import { tankRequestFormSchema, type TankRequestForm } from "@/lib/validations/tank-requests";
import { readTankSize } from "@/lib/validations/tank-size";

type Props = {
  draftId: string;
  plans: { id: string; name: string }[];
  center: { lat: number; lng: number };
  hostedStyleUrl: string | null;
  defaultWantedBy: string;
};

const FIELDS = ["tankType", "shape", "unit", "length", "width", "diameter", "depth", "lat", "lng", "readiness", "waterSource", "power", "wantedBy", "planId", "notes"] as const;

export function RequestForm({ draftId, plans, center, hostedStyleUrl, defaultWantedBy }: Props) {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const { register, handleSubmit, watch, setValue, setError, formState } = useForm<TankRequestForm>({
    resolver: zodResolver(tankRequestFormSchema, undefined, { raw: true }),
    defaultValues: { id: draftId, tankType: "tarpaulin", shape: "rectangular", unit: "m", length: "", width: "", diameter: "", depth: "", lat: "", lng: "", readiness: "compacted_ground", waterSource: "borehole", power: "none", wantedBy: defaultWantedBy, planId: "", notes: "" },
  });
  const errors = formState.errors;
  const err = (name: (typeof FIELDS)[number]) => errors[name]?.message;
  const values = watch();
  const size = readTankSize(values).size;
  // 1 m³ of fresh water weighs about 1 tonne (density ≈ 1000 kg/m³).
  const tonnes = size ? fullVolumeM3(storedSizeOf(size)) : null;

  const onSubmit = handleSubmit(async (raw) => {
    setFailure(null);
    const result = await postJson<{ id: string }>("/api/v1/tank-requests", raw);
    if (result.ok) return router.push(`/farmer/requests/${result.data.id}`);
    // Nothing was stored; everything typed stays in the form.
    for (const [path, messages] of Object.entries(result.fieldErrors ?? {})) {
      if ((FIELDS as readonly string[]).includes(path) && messages[0]) setError(path as FieldPath<TankRequestForm>, { message: messages[0] });
    }
    setFailure(result.message);
  });

  const select = (name: "waterSource" | "power" | "planId", label: string, options: [string, string][]) => (
    <Field id={`req-${name}`} label={label} error={err(name)}>
      <select id={`req-${name}`} className={inputClass} aria-invalid={Boolean(err(name))} aria-describedby={describedBy(`req-${name}`, err(name))} {...register(name)}>
        {options.map(([value, text]) => (
          <option key={value} value={value}>
            {text}
          </option>
        ))}
      </select>
    </Field>
  );

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5" aria-label="Tank request">
      <Card className="space-y-4">
        <h2 className="text-lg font-semibold">The tank</h2>
        <TankSizeFields
          idPrefix="req"
          register={{ tankType: register("tankType"), shape: register("shape"), unit: register("unit"), length: register("length"), width: register("width"), diameter: register("diameter"), depth: register("depth") }}
          shape={values.shape}
          unit={values.unit}
          errors={{ tankType: err("tankType"), length: err("length"), width: err("width"), diameter: err("diameter"), depth: err("depth") }}
        />
        {plans.length ? (
          select("planId", "Attach one of your saved plans (optional)", [["", "No plan"], ...plans.map((p): [string, string] => [p.id, p.name])])
        ) : (
          <p className="text-sm text-silt-600">
            You can attach a saved plan from the <Link href="/planner" className="font-medium text-lagoon-700 underline underline-offset-2">tank planner</Link>.
          </p>
        )}
      </Card>

      <Card className="space-y-4">
        <h2 className="text-lg font-semibold">The site</h2>
        <PointFields
          idPrefix="req"
          legend="Where the tank will stand"
          hint="Builders see only the straight-line distance and a point rounded to about 1 km until you accept a quote."
          register={{ lat: register("lat"), lng: register("lng") }}
          value={{ lat: values.lat, lng: values.lng }}
          errors={{ lat: err("lat"), lng: err("lng") }}
          center={center}
          hostedStyleUrl={hostedStyleUrl}
          onPick={(p) => {
            setValue("lat", String(p.lat), { shouldValidate: formState.isSubmitted });
            setValue("lng", String(p.lng), { shouldValidate: formState.isSubmitted });
          }}
        />
        <fieldset>
          <legend className="mb-1.5 text-sm font-medium text-silt-800">The ground where it will stand</legend>
          <div className="grid gap-2 sm:grid-cols-3">
            {SITE_READINESS.map((r) => (
              <label key={r} className="flex min-h-11 cursor-pointer items-center gap-2 rounded-lg border border-silt-300 bg-white px-3 py-2 text-sm has-[:checked]:border-lagoon-600 has-[:checked]:bg-lagoon-50">
                <input type="radio" value={r} className="h-4 w-4 accent-lagoon-600" {...register("readiness")} />
                {SITE_READINESS_LABEL[r]}
              </label>
            ))}
          </div>
          <div className="mt-2 rounded-lg border border-reed-200 bg-reed-50 p-3 text-sm text-reed-900" role="note">
            <p>
              A full tank weighs tonnes{tonnes ? `: this one holds about ${tonnes.toFixed(1)} m³, roughly ${tonnes.toFixed(1)} tonnes of water` : ""}. It needs a level
              concrete slab or well-compacted ground. Your builder decides on the base and the frame, and local building codes come first.{" "}
              <Link href="/safety" className="font-medium underline underline-offset-2">
                Safety around tanks
              </Link>
            </p>
          </div>
        </fieldset>
        <div className="grid gap-4 sm:grid-cols-2">
          {select("waterSource", "Water at the site", WATER_SOURCES.map((w) => [w, WATER_SOURCE_LABEL[w]]))}
          {select("power", "Power at the site", POWER_SOURCES.map((p) => [p, POWER_SOURCE_LABEL[p]]))}
        </div>
        <Field id="req-wantedBy" label="Wanted by" error={err("wantedBy")}>
          <input id="req-wantedBy" type="date" className={inputClass} aria-invalid={Boolean(err("wantedBy"))} aria-describedby={describedBy("req-wantedBy", err("wantedBy"))} {...register("wantedBy")} />
        </Field>
        <Field id="req-notes" label="Anything else builders should know (optional)" hint="Access for a vehicle, slope, where water comes from…" error={err("notes")}>
          <textarea id="req-notes" rows={3} className={inputClass} aria-invalid={Boolean(err("notes"))} aria-describedby={describedBy("req-notes", err("notes"), true)} {...register("notes")} />
        </Field>
      </Card>

      <Card className="space-y-3">
        <h2 className="text-lg font-semibold">Photos of the site (optional)</h2>
        <p className="text-sm text-silt-600">Photos help builders judge the ground and access before they visit.</p>
        <ImageUploader kind="site-photo" presignUrl="/api/v1/uploads/presign" completeUrl="/api/v1/uploads/complete" context={{ subjectId: draftId }} />
      </Card>

      {/* Beside the button, where the eye is after pressing it: the form is long. */}
      <FormError message={failure} />
      <Button type="submit" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? "Posting…" : "Post the request"}
      </Button>
    </form>
  );
}
