import type { Metadata } from "next";
import { randomUUID } from "node:crypto";
import { PageHeading } from "@/components/ui/card";
import { requirePagePermission } from "@/lib/auth/session";
import { env } from "@/lib/env";
import { listOwnPlans } from "@/lib/plans/plan-service";
import { getOwnProfile } from "@/lib/profiles/onboarding";
import { RequestForm } from "./_components/request-form";

export const metadata: Metadata = { title: "Ask for a tank" };

// Lusaka, where the map opens for a farmer with no point on their profile.
const DEFAULT_CENTER = { lat: -15.4167, lng: 28.2833 };

export default async function NewRequestPage() {
  const user = await requirePagePermission("tank-request:post", "/farmer/requests/new");
  const [plans, profile] = await Promise.all([listOwnPlans(user.id), getOwnProfile(user.id)]);
  const center = profile?.lat != null && profile.lng != null ? { lat: profile.lat, lng: profile.lng } : DEFAULT_CENTER;
  const inFourWeeks = new Date(Date.now() + 28 * 24 * 3600 * 1000).toISOString().slice(0, 10);
  return (
    <div className="mx-auto max-w-3xl">
      <PageHeading title="Ask for a tank" lead="Builders whose service area covers your site are told at once and answer with itemised quotes. You choose; nothing is paid until you accept one." />
      {/* A fresh id per visit: site photos uploaded before posting are filed under it, and posting twice stores one request. */}
      <RequestForm draftId={randomUUID()} plans={plans.map((p) => ({ id: p.id, name: p.name }))} center={center} hostedStyleUrl={env.MAP_STYLE_URL ?? null} defaultWantedBy={inFourWeeks} />
    </div>
  );
}
