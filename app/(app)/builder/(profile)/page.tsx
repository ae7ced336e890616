import type { Metadata } from "next";
import { PageHeading } from "@/components/ui/card";
import { requirePagePermission } from "@/lib/auth/session";
import { env } from "@/lib/env";
import { getBuilderProfile } from "@/lib/profiles/provider-profile";
import { BuilderProfileForm } from "./_components/builder-profile-form";

export const metadata: Metadata = { title: "Tank builder" };

export default async function BuilderPage() {
  const user = await requirePagePermission("builder:manage", "/builder");
  const current = (await getBuilderProfile(user.id)) ?? {
    serviceRadiusKm: 30,
    currency: env.DEFAULT_CURRENCY,
    baseFeeMinor: 0,
    travelRatePerKmMinor: 0,
    prices: [],
  };
  return (
    <div className="mx-auto max-w-3xl">
      <PageHeading
        title="Your service and prices"
        lead="Farmers see your starting prices; quotes add travel from your base at your rate per kilometre."
      />
      <BuilderProfileForm providerId={user.id} initial={current} />
    </div>
  );
}
