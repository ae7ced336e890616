"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { describedBy, Field, FormError, Input } from "@/components/ui/field";
import { authApi } from "@/lib/auth/auth-api";
import { signInSchema } from "@/lib/validations/profile";

type Values = z.input<typeof signInSchema>;

export function SignInForm({ next }: { next: string }) {
  const router = useRouter();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<Values>({ resolver: zodResolver(signInSchema) });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    const { error } = await authApi.signIn({ email: values.email.trim(), password: values.password, callbackURL: next });
    if (error) {
      // status 0: the request never reached us (offline); lib/auth/auth-api.ts words that.
      if (error.status === 0) setFormError(error.message ?? "You seem to be offline. Check your connection and try again.");
      else if (error.code === "EMAIL_NOT_VERIFIED") setFormError("Confirm your e-mail first. We have sent you a new confirmation link.");
      else if (error.status === 429) setFormError("Too many attempts. Wait a minute and try again.");
      else setFormError("That e-mail and password do not match an account.");
      return;
    }
    router.push(next);
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <FormError message={formError} />
      <Field id="email" label="E-mail" error={errors.email?.message}>
        <Input id="email" type="email" autoComplete="email" inputMode="email" aria-invalid={Boolean(errors.email)} aria-describedby={describedBy("email", errors.email?.message)} {...register("email")} />
      </Field>
      <Field id="password" label="Password" error={errors.password?.message}>
        <Input id="password" type="password" autoComplete="current-password" aria-invalid={Boolean(errors.password)} aria-describedby={describedBy("password", errors.password?.message)} {...register("password")} />
      </Field>
      <Button type="submit" disabled={isSubmitting} className="w-full">
        {isSubmitting ? "Signing in…" : "Sign in"}
      </Button>
    </form>
  );
}
