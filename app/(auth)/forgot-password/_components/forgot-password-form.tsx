"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { describedBy, Field, FormError, FormNotice, Input } from "@/components/ui/field";
import { authApi } from "@/lib/auth/auth-api";
import { forgotPasswordSchema } from "@/lib/validations/profile";

type Values = z.input<typeof forgotPasswordSchema>;

export function ForgotPasswordForm() {
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<Values>({ resolver: zodResolver(forgotPasswordSchema) });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async ({ email }) => {
    setFormError(null);
    const { error } = await authApi.requestPasswordReset({ email: email.trim(), redirectTo: "/reset-password" });
    if (error) {
      setFormError(error.status === 0 ? (error.message ?? "You seem to be offline.") : error.status === 429 ? "Too many requests. Wait a minute and try again." : "We could not send the link. Try again.");
      return;
    }
    setSentTo(email.trim());
  });

  if (sentTo) {
    return (
      <FormNotice>
        If an account exists for <strong className="break-all">{sentTo}</strong>, a link to set a new password is on its way. It works for one hour.
      </FormNotice>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <FormError message={formError} />
      <Field id="email" label="E-mail" error={errors.email?.message}>
        <Input id="email" type="email" autoComplete="email" inputMode="email" aria-invalid={Boolean(errors.email)} aria-describedby={describedBy("email", errors.email?.message)} {...register("email")} />
      </Field>
      <Button type="submit" disabled={isSubmitting} className="w-full">
        {isSubmitting ? "Sending…" : "Send the link"}
      </Button>
    </form>
  );
}
