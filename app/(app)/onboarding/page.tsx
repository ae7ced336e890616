import type { Metadata } from "next";
import { PageHeading } from "@/components/ui/card";
import { requirePageUser } from "@/lib/auth/session";
import { getOwnProfile } from "@/lib/profiles/onboarding";
import { OnboardingForm } from "./_components/onboarding-form";

export const metadata: Metadata = { title: "About you" };

export default async function OnboardingPage() {
  const user = await requirePageUser("/onboarding");
  const existing = await getOwnProfile(user.id);
  const selfRoles = user.roles.filter((r) => r !== "admin");
  return (
    <div className="mx-auto max-w-2xl">
      <PageHeading
        title={user.onboarded ? "Your profile" : `Welcome, ${user.name}`}
        lead="Tell us what you do. One account can farm, build tanks and run a hatchery; add roles at any time."
      />
      <OnboardingForm
        initial={{
          roles: selfRoles.length ? selfRoles : [],
          displayName: existing?.displayName ?? user.name,
          region: existing?.region ?? "",
          phone: existing?.phone ?? "",
          lat: existing?.lat ?? undefined,
          lng: existing?.lng ?? undefined,
          about: existing?.about ?? "",
        }}
        lockedRoles={selfRoles}
      />
    </div>
  );
}
