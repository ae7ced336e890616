import type { Metadata } from "next";
import Link from "next/link";
import { Card } from "@/components/ui/card";
import { SignUpForm } from "./_components/sign-up-form";

export const metadata: Metadata = { title: "Create an account" };

export default function SignUpPage() {
  return (
    <Card>
      <h1 className="text-2xl font-semibold text-silt-950">Create your Shoal account</h1>
      <p className="mt-1 text-sm text-silt-700">Free for farmers, builders and hatcheries. You choose what you do after confirming your e-mail.</p>
      <div className="mt-6">
        <SignUpForm />
      </div>
      <p className="mt-6 text-sm text-silt-700">
        Already have an account?{" "}
        <Link href="/sign-in" className="font-medium text-lagoon-700 underline underline-offset-2">
          Sign in
        </Link>
      </p>
    </Card>
  );
}
