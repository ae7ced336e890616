import type { Metadata } from "next";
import Link from "next/link";
import { Card } from "@/components/ui/card";
import { env } from "@/lib/env";

export const metadata: Metadata = { title: "Check your e-mail" };

export default async function CheckEmailPage({ searchParams }: { searchParams: Promise<{ email?: string }> }) {
  const { email } = await searchParams;
  return (
    <Card>
      <h1 className="text-2xl font-semibold text-silt-950">Check your e-mail</h1>
      <p className="mt-2 text-silt-700">
        We sent a confirmation link to <strong className="break-all">{email ?? "your address"}</strong>. Open it on this device to finish
        creating your account. It can take a minute to arrive; look in spam too.
      </p>
      {env.DEV_OUTBOX ? (
        <p className="mt-4 rounded-lg bg-reed-50 p-3 text-sm text-reed-800">
          This is a demo server: e-mails stay on it. Read them in the{" "}
          <Link href="/dev/outbox" className="font-semibold underline underline-offset-2">
            outbox
          </Link>
          .
        </p>
      ) : null}
      <p className="mt-6 text-sm text-silt-700">
        Confirmed already?{" "}
        <Link href="/sign-in" className="font-medium text-lagoon-700 underline underline-offset-2">
          Sign in
        </Link>
      </p>
    </Card>
  );
}
