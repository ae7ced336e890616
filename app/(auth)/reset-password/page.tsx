import type { Metadata } from "next";
import Link from "next/link";
import { Card } from "@/components/ui/card";
import { ResetPasswordForm } from "./_components/reset-password-form";

export const metadata: Metadata = { title: "Choose a new password" };

export default async function ResetPasswordPage({ searchParams }: { searchParams: Promise<{ token?: string; error?: string }> }) {
  const { token, error } = await searchParams;
  return (
    <Card>
      <h1 className="text-2xl font-semibold text-silt-950">Choose a new password</h1>
      {!token || error ? (
        <div className="mt-4 space-y-3 text-silt-700">
          <p>This link is not valid any more. Links work for one hour and only once.</p>
          <Link href="/forgot-password" className="font-medium text-lagoon-700 underline underline-offset-2">
            Send a new link
          </Link>
        </div>
      ) : (
        <div className="mt-6">
          <ResetPasswordForm token={token} />
        </div>
      )}
    </Card>
  );
}
