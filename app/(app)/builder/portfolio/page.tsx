import type { Metadata } from "next";
import { randomUUID } from "node:crypto";
import { PortfolioGrid } from "@/components/jobs/portfolio-grid";
import { ButtonLink } from "@/components/ui/button";
import { Card, PageHeading } from "@/components/ui/card";
import { requirePagePermission } from "@/lib/auth/session";
import { env } from "@/lib/env";
import { listPortfolio } from "@/lib/portfolio/portfolio-service";
import { getOwnProfile } from "@/lib/profiles/onboarding";
import { DeleteItem } from "./_components/delete-item";
import { PortfolioForm } from "./_components/portfolio-form";

export const metadata: Metadata = { title: "Your portfolio" };

export default async function BuilderPortfolioPage() {
  const user = await requirePagePermission("portfolio:manage", "/builder/portfolio");
  const [items, profile] = await Promise.all([listPortfolio(user.id), getOwnProfile(user.id)]);
  const center = profile?.lat != null && profile.lng != null ? { lat: profile.lat, lng: profile.lng } : { lat: -15.4167, lng: 28.2833 };
  const draftId = randomUUID();
  return (
    <div className="space-y-6">
      <PageHeading title="Your portfolio" lead="Finished tanks farmers see on your public page. Tanks from jobs completed through Shoal are added for you, with the mark.">
        <ButtonLink href={`/providers/${user.id}#finished-tanks`} variant="secondary">
          See your public page
        </ButtonLink>
      </PageHeading>
      <div className="grid gap-6 lg:grid-cols-[1fr_24rem]">
        <section aria-labelledby="items-heading" className="min-w-0 space-y-3">
          <h2 id="items-heading" className="text-lg font-semibold">
            {items.length} finished {items.length === 1 ? "tank" : "tanks"}
          </h2>
          {items.length ? (
            <PortfolioGrid items={items} actions={(item) => (item.throughShoal ? null : <DeleteItem itemId={item.id} />)} />
          ) : (
            <Card>
              <p className="text-silt-700">Add the tanks you have built, with photos: farmers choosing a builder look here first.</p>
            </Card>
          )}
        </section>
        <Card className="space-y-3 self-start">
          <h2 className="text-lg font-semibold">Add a finished tank</h2>
          <PortfolioForm key={draftId} draftId={draftId} center={center} hostedStyleUrl={env.MAP_STYLE_URL ?? null} today={new Date().toISOString().slice(0, 10)} />
        </Card>
      </div>
    </div>
  );
}
