"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { describedBy, Field, FormError, Input } from "@/components/ui/field";
import { authApi } from "@/lib/auth/auth-api";
import { signUpSchema } from "@/lib/validations/profile";

type Values = z.input<typeof signUpSchema>;

export function SignUpForm() {
  const router = useRouter();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<Values>({ resolver: zodResolver(signUpSchema), mode: "onTouched" });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    const { error } = await authApi.signUp({
      name: values.name.trim(),
      email: values.email.trim(),
      password: values.password,
      callbackURL: "/onboarding",
    });
    if (error) {
      setFormError(
        error.code === "USER_ALREADY_EXISTS" || error.code === "USER_ALREADY_EXISTS_USE_ANOTHER_EMAIL"
          ? "An account with this e-mail already exists. Sign in, or reset your password."
          : (error.message ?? "We could not create the account. Try again."),
      );
      return;
    }
    router.push(`/check-email?email=${encodeURIComponent(values.email.trim())}`);
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <FormError message={formError} />
      <Field id="name" label="Your name or business name" error={errors.name?.message}>
        <Input id="name" autoComplete="name" aria-invalid={Boolean(errors.name)} aria-describedby={describedBy("name", errors.name?.message)} {...register("name")} />
      </Field>
      <Field id="email" label="E-mail" error={errors.email?.message}>
        <Input id="email" type="email" autoComplete="email" inputMode="email" aria-invalid={Boolean(errors.email)} aria-describedby={describedBy("email", errors.email?.message)} {...register("email")} />
      </Field>
      <Field id="password" label="Password" hint="At least 10 characters." error={errors.password?.message}>
        <Input id="password" type="password" autoComplete="new-password" aria-invalid={Boolean(errors.password)} aria-describedby={describedBy("password", errors.password?.message, true)} {...register("password")} />
      </Field>
      <Field id="confirm" label="Password again" error={errors.confirm?.message}>
        <Input id="confirm" type="password" autoComplete="new-password" aria-invalid={Boolean(errors.confirm)} aria-describedby={describedBy("confirm", errors.confirm?.message)} {...register("confirm")} />
      </Field>
      <Button type="submit" disabled={isSubmitting} className="w-full">
        {isSubmitting ? "Creating account…" : "Create account"}
      </Button>
    </form>
  );
}
