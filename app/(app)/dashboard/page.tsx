import type { Metadata } from "next";
import Link from "next/link";
import { Card, PageHeading } from "@/components/ui/card";
import { can } from "@/lib/auth/permissions";
import { requirePageUser } from "@/lib/auth/session";
import { getOwnProfile } from "@/lib/profiles/onboarding";
import { countPendingProviders } from "@/lib/profiles/verification";

export const metadata: Metadata = { title: "My Shoal" };

const ROLE_LABEL = { farmer: "Farmer", hatchery: "Hatchery", builder: "Tank builder", admin: "Admin" } as const;
const VERIFICATION_TEXT: Record<string, string> = {
  unverified: "Not checked",
  pending: "Waiting for a Shoal check",
  verified: "Checked by Shoal",
  rejected: "Check failed: update your profile",
};

export default async function DashboardPage() {
  const user = await requirePageUser("/dashboard");

  const profile = await getOwnProfile(user.id);
  const pending = can(user, "admin:verify-providers") ? await countPendingProviders() : 0;
  const provider = user.roles.includes("hatchery") || user.roles.includes("builder");

  return (
    <div>
      <PageHeading title={`Hello, ${profile?.displayName ?? user.name}`} lead="Everything you do on Shoal starts here.">
        {/* A list, so its name is read (aria-label on a plain div is ignored by screen readers: ARIA 1.2). */}
        <ul className="flex flex-wrap gap-2" aria-label="Your roles">
          {user.roles.map((r) => (
            <li key={r} className="rounded-full bg-lagoon-100 px-3 py-1 text-sm font-medium text-lagoon-800">
              {ROLE_LABEL[r]}
            </li>
          ))}
        </ul>
      </PageHeading>

      <div className="grid gap-4 md:grid-cols-2">
        {user.roles.includes("farmer") ? (
          <Card>
            <h2 className="text-lg font-semibold">Your farm</h2>
            <ol className="mt-3 list-decimal space-y-2 pl-5 text-sm text-silt-700">
              <li>Decide on a tank that fits your space: tarpaulin tanks cost least, concrete more, an excavated pond most.</li>
              <li>Prepare a level, compacted base or slab where the tank will stand.</li>
              <li>Plan to keep new fingerlings in a net enclosure (hapa) inside the tank for about a week before releasing them.</li>
            </ol>
            <ul className="mt-3 space-y-2 text-sm">
              <li>
                <Link href="/farmer/requests/new" className="font-medium text-lagoon-700 underline underline-offset-2">
                  Ask builders near you for a tank
                </Link>
              </li>
              <li>
                <Link href="/farmer/requests" className="font-medium text-lagoon-700 underline underline-offset-2">
                  Your tank requests, quotes and jobs
                </Link>
              </li>
              <li>
                <Link href="/farmer/reservations" className="font-medium text-lagoon-700 underline underline-offset-2">
                  Your fingerling reservations
                </Link>
              </li>
              <li>
                <Link href="/safety" className="font-medium text-lagoon-700 underline underline-offset-2">
                  Safety around tanks and pumps
                </Link>
              </li>
            </ul>
          </Card>
        ) : null}

        {provider ? (
          <Card>
            <h2 className="text-lg font-semibold">Your business</h2>
            <p className="mt-1 text-sm text-silt-700">
              Verification: <strong>{VERIFICATION_TEXT[profile?.verificationState ?? "unverified"]}</strong>
            </p>
            <ul className="mt-3 space-y-2 text-sm">
              {user.roles.includes("builder") ? (
                <li>
                  <Link href="/builder" className="font-medium text-lagoon-700 underline underline-offset-2">
                    Service area and price sheet
                  </Link>
                </li>
              ) : null}
              {user.roles.includes("builder") ? (
                <>
                  <li>
                    <Link href="/builder/requests" className="font-medium text-lagoon-700 underline underline-offset-2">
                      Tank requests near you
                    </Link>
                  </li>
                  <li>
                    <Link href="/builder/jobs" className="font-medium text-lagoon-700 underline underline-offset-2">
                      Your jobs
                    </Link>
                  </li>
                  <li>
                    <Link href="/builder/portfolio" className="font-medium text-lagoon-700 underline underline-offset-2">
                      Your portfolio of finished tanks
                    </Link>
                  </li>
                </>
              ) : null}
              {user.roles.includes("hatchery") ? (
                <>
                  <li>
                    <Link href="/hatchery" className="font-medium text-lagoon-700 underline underline-offset-2">
                      Species and delivery
                    </Link>
                  </li>
                  <li>
                    <Link href="/hatchery/batches" className="font-medium text-lagoon-700 underline underline-offset-2">
                      Batches on offer
                    </Link>
                  </li>
                  <li>
                    <Link href="/hatchery/reservations" className="font-medium text-lagoon-700 underline underline-offset-2">
                      Reservations
                    </Link>
                  </li>
                </>
              ) : null}
            </ul>
          </Card>
        ) : null}

        {user.roles.includes("admin") ? (
          <Card>
            <h2 className="text-lg font-semibold">Administration</h2>
            <p className="mt-1 text-sm text-silt-700">
              {pending === 0 ? "No providers are waiting for a check." : `${pending} provider${pending === 1 ? " is" : "s are"} waiting for a check.`}
            </p>
            <Link href="/admin" className="mt-3 inline-block text-sm font-medium text-lagoon-700 underline underline-offset-2">
              Open the verification queue
            </Link>
          </Card>
        ) : null}

        <Card>
          <h2 className="text-lg font-semibold">Profile</h2>
          <dl className="mt-2 grid grid-cols-[7rem_1fr] gap-y-1 text-sm">
            <dt className="text-silt-600">E-mail</dt>
            <dd className="break-all">{user.email}</dd>
            <dt className="text-silt-600">Phone</dt>
            <dd>{profile?.phone ?? "—"}</dd>
            <dt className="text-silt-600">Region</dt>
            <dd>{profile?.region ?? "—"}</dd>
          </dl>
          <Link href="/onboarding" className="mt-3 inline-block text-sm font-medium text-lagoon-700 underline underline-offset-2">
            Edit profile or add a role
          </Link>
        </Card>
      </div>
    </div>
  );
}
