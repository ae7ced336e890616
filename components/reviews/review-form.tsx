"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useEffect, useMemo, useState } from "react";
import { Controller, useForm, type FieldPath } from "react-hook-form";
import type { z } from "zod";
import { StarInput } from "@/components/reviews/star-input";
import { ImageUploader } from "@/components/upload/image-uploader";
import { Button } from "@/components/ui/button";
import { describedBy, FormError, inputClass } from "@/components/ui/field";
import { patchJson, postJson } from "@/lib/api/client";
import { ASPECT_LABELS, REVIEW_ASPECTS, REVIEW_LIMITS, type AspectKey, type PublicReview, type ReviewRole, type ReviewSubjectKind } from "@/lib/reviews/types";
import { imageSrcSet, imageUrl, fallbackWidth } from "@/lib/storage/image-urls";
import type { ProcessedUpload } from "@/lib/storage/upload-contract";
import { reviewFormSchema } from "@/lib/validations/reviews";

type Photo = { imageId: string; src: string; srcSet: string; width: number; height: number; alt: string };

type Props = {
  role: ReviewRole;
  subjectKind: ReviewSubjectKind;
  subjectId: string;
  providerName: string;
  /** where to go once the review is stored (the job or reservation page) */
  returnTo: string;
  /** set when editing: the stored review */
  existing?: PublicReview;
};

type Schema = ReturnType<typeof reviewFormSchema>;
type FormInput = z.input<Schema>;
type FormOutput = z.output<Schema>;

function fromUpload(image: ProcessedUpload): Photo | null {
  const src = fallbackWidth(image.widths, 320);
  if (src === undefined) return null;
  return { imageId: image.imageId, src: imageUrl(image.imageId, src), srcSet: imageSrcSet(image.imageId, image.widths), width: image.width, height: image.height, alt: "" };
}

const QUESTION: Record<ReviewRole, string> = {
  builder: "How was the tank and the work?",
  hatchery: "How were the fish?",
};

const PROMPT: Record<ReviewRole, string> = {
  builder: "What was built, did it hold water, was the site left tidy, would you hire them again?",
  hatchery: "How many arrived alive, were they the size agreed, how did they do in the first week?",
};

/**
 * Writing or changing a review: overall and per-aspect stars, the text with a counter, and up to six photos. The
 * zod schema is the server's; on a refused or failed request everything typed stays in the form.
 */
export function ReviewForm({ role, subjectKind, subjectId, providerName, returnTo, existing }: Props) {
  const router = useRouter();
  const schema = useMemo(() => reviewFormSchema(role), [role]);
  const aspects = REVIEW_ASPECTS[role] as readonly AspectKey[];
  const [failure, setFailure] = useState<string | null>(null);
  const [photos, setPhotos] = useState<Photo[]>(() => existing?.photos.map((p) => ({ ...p })) ?? []);
  // The uploader counts its own uploads on top of `existingCount`, so it gets the count from when it appeared;
  // removing a photo remounts it with the photos kept.
  const [uploader, setUploader] = useState(() => ({ key: 0, existing: existing?.photos.length ?? 0 }));

  const { control, register, handleSubmit, setError, setValue, watch, formState } = useForm<FormInput, unknown, FormOutput>({
    resolver: zodResolver(schema),
    defaultValues: {
      stars: existing?.stars,
      aspects: Object.fromEntries(aspects.map((a) => [a, existing?.aspects[a]])),
      body: existing?.body ?? "",
      photoIds: existing?.photos.map((p) => p.imageId) ?? [],
    } as FormInput,
  });
  const errors = formState.errors;
  const bodyLength = (watch("body") ?? "").length;
  const bodyError = errors.body?.message;
  const photoError = errors.photoIds?.message;

  const submitted = formState.isSubmitted;
  // The form sends the ids of the photos shown, in their order.
  useEffect(() => {
    setValue(
      "photoIds",
      photos.map((p) => p.imageId),
      { shouldValidate: submitted },
    );
  }, [photos, setValue, submitted]);

  const onSubmit = handleSubmit(async (values) => {
    setFailure(null);
    const result = existing
      ? await patchJson<{ review: PublicReview }>(`/api/v1/reviews/${existing.id}`, values)
      : await postJson<{ review: PublicReview }>("/api/v1/reviews", { subjectKind, subjectId, ...values });
    if (result.ok) {
      router.push(returnTo);
      router.refresh();
      return;
    }
    // Nothing was stored; the stars, text and photos stay as they were.
    let named = false;
    for (const [path, messages] of Object.entries(result.fieldErrors ?? {})) {
      const message = messages[0];
      if (!message) continue;
      if (path === "stars" || path === "body" || path === "photoIds" || (path.startsWith("aspects.") && aspects.includes(path.slice(8) as AspectKey))) {
        setError(path as FieldPath<FormInput>, { message });
        named = true;
      }
    }
    setFailure(named ? "Some answers need another look: see the messages below." : result.message);
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-6" aria-labelledby="review-form-heading">
      <h2 id="review-form-heading" className="sr-only">
        {existing ? "Change your review" : `Review ${providerName}`}
      </h2>
      <FormError message={failure} />

      <Controller
        control={control}
        name="stars"
        render={({ field }) => (
          <StarInput name="review-stars" legend={`Overall, how was ${providerName}?`} value={field.value} onChange={field.onChange} onBlur={field.onBlur} inputRef={field.ref} error={errors.stars?.message} size="lg" />
        )}
      />

      <fieldset className="space-y-4 rounded-card border border-silt-200 p-4">
        <legend className="px-1 text-sm font-semibold text-silt-900">{QUESTION[role]}</legend>
        {aspects.map((aspect) => (
          <Controller
            key={aspect}
            control={control}
            name={`aspects.${aspect}` as FieldPath<FormInput>}
            render={({ field }) => (
              <StarInput
                name={`review-aspect-${aspect}`}
                legend={ASPECT_LABELS[aspect]}
                value={typeof field.value === "number" ? field.value : undefined}
                onChange={field.onChange}
                onBlur={field.onBlur}
                inputRef={field.ref}
                error={(errors.aspects as Partial<Record<AspectKey, { message?: string }>> | undefined)?.[aspect]?.message}
              />
            )}
          />
        ))}
      </fieldset>

      <div className="space-y-1.5">
        <label htmlFor="review-body" className="block text-sm font-medium text-silt-800">
          In your own words
        </label>
        <textarea
          id="review-body"
          rows={6}
          maxLength={REVIEW_LIMITS.bodyMax}
          className={inputClass}
          placeholder={PROMPT[role]}
          aria-invalid={Boolean(bodyError)}
          aria-describedby={`${describedBy("review-body", bodyError, true)} review-body-count`}
          {...register("body")}
        />
        <div className="flex flex-wrap items-start justify-between gap-2">
          {bodyError ? (
            <p id="review-body-error" role="alert" className="text-sm font-medium text-clay-600">
              {bodyError}
            </p>
          ) : (
            <p id="review-body-hint" className="text-xs text-silt-600">
              At least {REVIEW_LIMITS.bodyMin} characters. Other farmers read this: stick to what happened, and leave out phone numbers and addresses.
            </p>
          )}
          <p id="review-body-count" className={`ml-auto text-xs tabular-nums ${bodyLength > REVIEW_LIMITS.bodyMax - 100 ? "font-semibold text-reed-800" : "text-silt-600"}`}>
            {bodyLength.toLocaleString("en")} of {REVIEW_LIMITS.bodyMax.toLocaleString("en")} characters
          </p>
        </div>
      </div>

      <section aria-labelledby="review-photos-heading" className="space-y-3">
        <h3 id="review-photos-heading" className="text-sm font-semibold text-silt-900">
          Photos (optional, up to {REVIEW_LIMITS.maxPhotos})
        </h3>
        {photos.length ? (
          <ul className="grid grid-cols-3 gap-2 sm:grid-cols-6" aria-label="Photos in your review" data-testid="review-photos">
            {photos.map((p, i) => (
              <li key={p.imageId} className="space-y-1">
                <img src={p.src} srcSet={p.srcSet} sizes="(min-width: 640px) 96px, 30vw" width={p.width} height={p.height} alt={p.alt || `Your photo ${i + 1}`} loading="lazy" decoding="async" className="aspect-square h-auto w-full rounded-lg border border-silt-200 object-cover" />
                <button type="button" onClick={() => {
                    const kept = photos.filter((x) => x.imageId !== p.imageId);
                    setPhotos(kept);
                    setUploader((u) => ({ key: u.key + 1, existing: kept.length }));
                  }} className="min-h-11 w-full rounded-lg text-xs font-medium text-clay-700 underline underline-offset-2 hover:bg-clay-50">
                  Remove<span className="sr-only"> photo {i + 1}</span>
                </button>
              </li>
            ))}
          </ul>
        ) : null}
        {photos.length < REVIEW_LIMITS.maxPhotos ? (
          <ImageUploader
            key={uploader.key}
            kind="review-photo"
            presignUrl="/api/v1/uploads/presign"
            completeUrl="/api/v1/uploads/complete"
            context={{ subjectId }}
            existingCount={uploader.existing}
            label="Add photos"
            hideDone
            onUploaded={(image) => {
              const photo = fromUpload(image);
              if (photo) setPhotos((all) => [...all, photo]);
            }}
          />
        ) : (
          <p className="text-sm text-silt-600">That is the most a review can hold. Remove one to add another.</p>
        )}
        {photoError ? (
          <p role="alert" className="text-sm font-medium text-clay-600">
            {photoError}
          </p>
        ) : null}
      </section>

      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" disabled={formState.isSubmitting}>
          {formState.isSubmitting ? "Sending…" : existing ? "Save the changes" : "Publish the review"}
        </Button>
        <p className="text-xs text-silt-600">
          {existing
            ? "The change shows at once, marked as changed; Shoal keeps the earlier version."
            : `You can change it for ${REVIEW_LIMITS.editDays} days after publishing. ${providerName} can answer once, in public.`}
        </p>
      </div>
    </form>
  );
}
