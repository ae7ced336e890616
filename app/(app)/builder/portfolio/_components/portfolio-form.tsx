"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, type FieldPath } from "react-hook-form";
import { PointFields } from "@/components/jobs/point-fields";
import { TankSizeFields } from "@/components/jobs/tank-size-fields";
import { ImageUploader } from "@/components/upload/image-uploader";
import { Button } from "@/components/ui/button";
import { describedBy, Field, FormError, Input, inputClass } from "@/components/ui/field";
import { postJson } from "@/lib/api/client";
import { portfolioItemFormSchema, type PortfolioItemForm } from "@/lib/validations/portfolio";

type Props = { draftId: string; center: { lat: number; lng: number }; hostedStyleUrl: string | null; today: string };

/** A finished tank added by hand: photos first (they are filed under the item's id), then the facts. */
export function PortfolioForm({ draftId, center, hostedStyleUrl, today }: Props) {
  const router = useRouter();
  const [failure, setFailure] = useState<string | null>(null);
  const [photos, setPhotos] = useState(0);
  const [photoError, setPhotoError] = useState<string | null>(null);
  const { register, handleSubmit, watch, setValue, setError, formState } = useForm<PortfolioItemForm>({
    resolver: zodResolver(portfolioItemFormSchema, undefined, { raw: true }),
    defaultValues: { id: draftId, tankType: "tarpaulin", shape: "rectangular", unit: "m", length: "", width: "", diameter: "", depth: "", lat: "", lng: "", placeName: "", completedOn: today, caption: "" },
  });
  const values = watch();
  const err = (name: FieldPath<PortfolioItemForm>) => formState.errors[name as keyof PortfolioItemForm]?.message;

  const onSubmit = handleSubmit(async (raw) => {
    setFailure(null);
    setPhotoError(null);
    const result = await postJson("/api/v1/portfolio", raw);
    if (result.ok) return router.refresh(); // the page hands out a new draft id, which resets this form
    for (const [path, messages] of Object.entries(result.fieldErrors ?? {})) {
      if (path === "photos") setPhotoError(messages[0] ?? null);
      else if (messages[0]) setError(path as FieldPath<PortfolioItemForm>, { message: messages[0] });
    }
    setFailure(result.message);
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5" aria-label="Add a finished tank">
      <FormError message={failure} />
      <div className="space-y-2">
        <ImageUploader kind="portfolio" presignUrl="/api/v1/uploads/presign" completeUrl="/api/v1/uploads/complete" context={{ subjectId: draftId }} label="Photos of the finished tank" onUploaded={() => setPhotos((n) => n + 1)} />
        {photoError ? <p role="alert" className="text-sm font-medium text-clay-600">{photoError}</p> : null}
      </div>
      <TankSizeFields
        idPrefix="pf"
        register={{ tankType: register("tankType"), shape: register("shape"), unit: register("unit"), length: register("length"), width: register("width"), diameter: register("diameter"), depth: register("depth") }}
        shape={values.shape}
        unit={values.unit}
        errors={{ tankType: err("tankType"), length: err("length"), width: err("width"), diameter: err("diameter"), depth: err("depth") }}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <Field id="pf-placeName" label="Town or area" hint="Shown with the tank, e.g. Chongwe" error={err("placeName")}>
          <Input id="pf-placeName" aria-invalid={Boolean(err("placeName"))} aria-describedby={describedBy("pf-placeName", err("placeName"), true)} {...register("placeName")} />
        </Field>
        <Field id="pf-completedOn" label="Finished on" error={err("completedOn")}>
          <input id="pf-completedOn" type="date" max={today} className={inputClass} aria-invalid={Boolean(err("completedOn"))} {...register("completedOn")} />
        </Field>
      </div>
      <PointFields
        idPrefix="pf"
        legend="Where it stands"
        hint="Stored rounded to about 1 km, so the owner's home is never shown."
        register={{ lat: register("lat"), lng: register("lng") }}
        value={{ lat: values.lat, lng: values.lng }}
        errors={{ lat: err("lat"), lng: err("lng") }}
        center={center}
        hostedStyleUrl={hostedStyleUrl}
        onPick={(p) => {
          setValue("lat", String(p.lat));
          setValue("lng", String(p.lng));
        }}
      />
      <Field id="pf-caption" label="Caption (optional)" error={err("caption")}>
        <Input id="pf-caption" maxLength={300} {...register("caption")} />
      </Field>
      <Button type="submit" disabled={formState.isSubmitting}>
        {formState.isSubmitting ? "Adding…" : photos ? "Add to my portfolio" : "Add to my portfolio (add a photo first)"}
      </Button>
    </form>
  );
}
