"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import { describedBy, Field, FormError, Input, inputClass } from "@/components/ui/field";
import { postJson } from "@/lib/api/client";
import type { SelfServiceRole } from "@/lib/auth/permissions";
import { onboardingSchema, SUGGESTED_REGIONS, type OnboardingInput, type OnboardingData } from "@/lib/validations/profile";

const ROLE_CHOICES: { value: SelfServiceRole; title: string; body: string }[] = [
  { value: "farmer", title: "I farm fish (or want to)", body: "Plan tanks, hire builders, reserve fingerlings." },
  { value: "builder", title: "I build tanks", body: "Tarpaulin, concrete or earthen ponds: quote on requests nearby." },
  { value: "hatchery", title: "I run a hatchery", body: "Post fingerling batches and take reservations." },
];

const numberOrUndefined = (v: unknown) => (v === "" || v === null || v === undefined ? undefined : Number(v));

export function OnboardingForm({ initial, lockedRoles }: { initial: OnboardingInput; lockedRoles: SelfServiceRole[] }) {
  const router = useRouter();
  const [formError, setFormError] = useState<string | null>(null);
  const [locating, setLocating] = useState(false);
  const { register, handleSubmit, formState, watch, setValue, setError } = useForm<OnboardingInput, unknown, OnboardingData>({
    resolver: zodResolver(onboardingSchema),
    defaultValues: initial,
  });
  const { errors, isSubmitting } = formState;
  const roles = watch("roles") ?? [];
  const provider = roles.includes("builder") || roles.includes("hatchery");

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    const result = await postJson("/api/v1/onboarding", values);
    if (!result.ok) {
      for (const [field, messages] of Object.entries(result.fieldErrors ?? {})) {
        setError(field as keyof OnboardingInput, { message: messages[0] });
      }
      setFormError(result.message);
      return;
    }
    router.push("/dashboard");
    router.refresh();
  });

  function useMyLocation() {
    if (!("geolocation" in navigator)) {
      setFormError("This browser cannot share its location. Type the coordinates instead.");
      return;
    }
    setLocating(true);
    navigator.geolocation.getCurrentPosition(
      (pos) => {
        setValue("lat", Number(pos.coords.latitude.toFixed(5)), { shouldValidate: true });
        setValue("lng", Number(pos.coords.longitude.toFixed(5)), { shouldValidate: true });
        setLocating(false);
      },
      () => {
        setFormError("We could not get your location. Type the coordinates instead.");
        setLocating(false);
      },
      { enableHighAccuracy: false, timeout: 10_000 },
    );
  }

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-6">
      <FormError message={formError} />
      <Card>
        <fieldset>
          <legend className="text-lg font-semibold text-silt-950">What do you do?</legend>
          <p className="text-sm text-silt-600">Choose one or more.</p>
          <div className="mt-4 grid gap-3 sm:grid-cols-3">
            {ROLE_CHOICES.map((choice) => (
              <label
                key={choice.value}
                className="flex cursor-pointer gap-3 rounded-lg border border-silt-200 p-3 has-[:checked]:border-lagoon-500 has-[:checked]:bg-lagoon-50"
              >
                <input
                  type="checkbox"
                  value={choice.value}
                  // Roles already held stay: the box cannot be unticked.
                  aria-disabled={lockedRoles.includes(choice.value) || undefined}
                  onClick={lockedRoles.includes(choice.value) ? (e) => e.preventDefault() : undefined}
                  className="mt-1 h-5 w-5 accent-lagoon-600"
                  {...register("roles")}
                />
                <span>
                  <span className="block font-medium text-silt-900">{choice.title}</span>
                  <span className="block text-sm text-silt-600">{choice.body}</span>
                </span>
              </label>
            ))}
          </div>
          {errors.roles ? (
            <p role="alert" className="mt-2 text-sm font-medium text-clay-600">
              {errors.roles.message}
            </p>
          ) : null}
        </fieldset>
      </Card>

      <Card className="space-y-4">
        <h2 className="text-lg font-semibold text-silt-950">Profile</h2>
        <Field id="displayName" label={provider ? "Business name (shown to buyers)" : "Name shown to others"} error={errors.displayName?.message}>
          <Input id="displayName" aria-invalid={Boolean(errors.displayName)} aria-describedby={describedBy("displayName", errors.displayName?.message)} {...register("displayName")} />
        </Field>
        <Field id="region" label="Region or province" error={errors.region?.message}>
          <Input id="region" list="region-suggestions" aria-invalid={Boolean(errors.region)} aria-describedby={describedBy("region", errors.region?.message)} {...register("region")} />
          <datalist id="region-suggestions">
            {SUGGESTED_REGIONS.map((r) => (
              <option key={r} value={r} />
            ))}
          </datalist>
        </Field>
        <Field
          id="phone"
          label={provider ? "Phone (buyers will call this)" : "Phone (optional)"}
          hint="International form, e.g. +260 97 123 4567"
          error={errors.phone?.message}
        >
          <Input id="phone" type="tel" autoComplete="tel" inputMode="tel" aria-invalid={Boolean(errors.phone)} aria-describedby={describedBy("phone", errors.phone?.message, true)} {...register("phone")} />
        </Field>
        <fieldset className="space-y-3">
          <legend className="text-sm font-medium text-silt-800">{provider ? "Where you work from" : "Where your farm is (optional)"}</legend>
          <p className="text-xs text-silt-600">
            Others see only an approximate point, rounded to about 1 km. Decimal degrees: latitude is negative south of the equator.
          </p>
          <div className="grid grid-cols-2 gap-3">
            <Field id="lat" label="Latitude" error={errors.lat?.message}>
              <Input id="lat" inputMode="decimal" aria-invalid={Boolean(errors.lat)} aria-describedby={describedBy("lat", errors.lat?.message)} {...register("lat", { setValueAs: numberOrUndefined })} />
            </Field>
            <Field id="lng" label="Longitude" error={errors.lng?.message}>
              <Input id="lng" inputMode="decimal" aria-invalid={Boolean(errors.lng)} aria-describedby={describedBy("lng", errors.lng?.message)} {...register("lng", { setValueAs: numberOrUndefined })} />
            </Field>
          </div>
          <Button type="button" variant="secondary" onClick={useMyLocation} disabled={locating}>
            {locating ? "Finding you…" : "Use my current location"}
          </Button>
        </fieldset>
        <Field id="about" label="About (optional)" hint="What you offer, since when, languages you speak." error={errors.about?.message}>
          <textarea id="about" rows={4} className={inputClass} aria-invalid={Boolean(errors.about)} aria-describedby={describedBy("about", errors.about?.message, true)} {...register("about")} />
        </Field>
      </Card>

      <Button type="submit" disabled={isSubmitting} className="w-full sm:w-auto">
        {isSubmitting ? "Saving…" : "Save and continue"}
      </Button>
    </form>
  );
}
