"use client";
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { describedBy, Field, FormError, Input } from "@/components/ui/field";
import { authApi } from "@/lib/auth/auth-api";
import { resetPasswordSchema } from "@/lib/validations/profile";

type Values = z.input<typeof resetPasswordSchema>;

export function ResetPasswordForm({ token }: { token: string }) {
  const router = useRouter();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<Values>({ resolver: zodResolver(resetPasswordSchema) });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async ({ password }) => {
    setFormError(null);
    const { error } = await authApi.resetPassword({ newPassword: password, token });
    if (error) {
      setFormError(error.code === "INVALID_TOKEN" ? "This link is not valid any more. Ask for a new one." : (error.message ?? "Could not change the password."));
      return;
    }
    router.push("/sign-in?reset=done");
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4">
      <FormError message={formError} />
      <Field id="password" label="New password" hint="At least 10 characters." error={errors.password?.message}>
        <Input id="password" type="password" autoComplete="new-password" aria-invalid={Boolean(errors.password)} aria-describedby={describedBy("password", errors.password?.message, true)} {...register("password")} />
      </Field>
      <Field id="confirm" label="New password again" error={errors.confirm?.message}>
        <Input id="confirm" type="password" autoComplete="new-password" aria-invalid={Boolean(errors.confirm)} aria-describedby={describedBy("confirm", errors.confirm?.message)} {...register("confirm")} />
      </Field>
      <Button type="submit" disabled={isSubmitting} className="w-full">
        {isSubmitting ? "Saving…" : "Save new password"}
      </Button>
    </form>
  );
}
