import type { Metadata } from "next";
import { Card } from "@/components/ui/card";
import { ForgotPasswordForm } from "./_components/forgot-password-form";

export const metadata: Metadata = { title: "Forgot your password" };

export default function ForgotPasswordPage() {
  return (
    <Card>
      <h1 className="text-2xl font-semibold text-silt-950">Forgot your password?</h1>
      <p className="mt-1 text-sm text-silt-700">Enter the e-mail of your account and we will send a link to choose a new password.</p>
      <div className="mt-6">
        <ForgotPasswordForm />
      </div>
    </Card>
  );
}
