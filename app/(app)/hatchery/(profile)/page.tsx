import type { Metadata } from "next";
import { PageHeading } from "@/components/ui/card";
import { requirePagePermission } from "@/lib/auth/session";
import { getHatcheryProfile } from "@/lib/profiles/provider-profile";
import { HatcheryProfileForm } from "./_components/hatchery-profile-form";

export const metadata: Metadata = { title: "Hatchery" };

export default async function HatcheryPage() {
  const user = await requirePagePermission("hatchery:manage", "/hatchery");
  const current = (await getHatcheryProfile(user.id)) ?? { species: [], delivers: false, deliveryRadiusKm: 0 };
  return (
    <div className="mx-auto max-w-2xl">
      <PageHeading title="Your hatchery" lead="What you produce and whether you deliver. Buyers filter on these." />
      <HatcheryProfileForm providerId={user.id} initial={current} />
    </div>
  );
}
