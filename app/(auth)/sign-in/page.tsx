import type { Metadata } from "next";
import Link from "next/link";
import { Card } from "@/components/ui/card";
import { FormNotice } from "@/components/ui/field";
import { SignInForm } from "./_components/sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

function safeNext(next: string | undefined): string {
  // Only same-site paths, so a crafted link cannot send people elsewhere after sign-in.
  return next && next.startsWith("/") && !next.startsWith("//") ? next : "/dashboard";
}

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string; reset?: string; error?: string }> }) {
  const params = await searchParams;
  return (
    <Card>
      <h1 className="text-2xl font-semibold text-silt-950">Sign in to Shoal</h1>
      <div className="mt-4 space-y-3">
        {params.reset === "done" ? <FormNotice>Your password was changed. Sign in with the new one.</FormNotice> : null}
        {params.error === "invalid_token" || params.error === "INVALID_TOKEN" ? (
          <FormNotice>That confirmation link is no longer valid. Sign in and we will send you a new one.</FormNotice>
        ) : null}
      </div>
      <div className="mt-4">
        <SignInForm next={safeNext(params.next)} />
      </div>
      <div className="mt-6 flex flex-wrap justify-between gap-2 text-sm text-silt-700">
        <Link href="/forgot-password" className="font-medium text-lagoon-700 underline underline-offset-2">
          Forgot your password?
        </Link>
        <Link href="/sign-up" className="font-medium text-lagoon-700 underline underline-offset-2">
          Create an account
        </Link>
      </div>
    </Card>
  );
}
