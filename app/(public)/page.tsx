import Link from "next/link";
import { ButtonLink } from "@/components/ui/button";
import { getCurrentUser } from "@/lib/auth/session";

const STEPS = [
  { title: "Plan the tank", body: "Pick a tarpaulin, concrete or earthen tank that fits your space and budget. A 6 ft × 10 ft tank is a common first size." },
  { title: "Hire a builder you can check", body: "See tanks a builder has finished, read reviews from farmers who paid them, and compare itemised quotes with travel shown." },
  { title: "Prepare a level base", body: "A tank full of water weighs tonnes. The builder needs a level slab or well-compacted ground before the frame goes up." },
  { title: "Reserve healthy fingerlings", body: "Reserve tilapia or African catfish from a hatchery, collect on time, and keep them in a net enclosure (hapa) for their first week." },
  { title: "Pay safely", body: "Your deposit is held by Shoal and only released when the tank is built or the fish are in your water." },
  { title: "Grow and sell", body: "Feed, change the water of a soil-less tank about weekly, and sell your harvest by weight." },
];

const ROLES = [
  { title: "New farmers", body: "Find help nearby, plan your first cycle, and keep your money safe until the work is done." },
  { title: "Tank builders", body: "Show your finished tanks, quote on requests near you, and grow through honest reviews." },
  { title: "Hatcheries", body: "Post batches by species and size, take reservations, and hand over on time." },
];

export default async function HomePage() {
  const user = await getCurrentUser();
  return (
    <div>
      <section className="bg-gradient-to-b from-lagoon-50 to-silt-50">
        <div className="mx-auto max-w-6xl px-4 pb-12 pt-10 sm:pt-16">
          <p className="text-sm font-semibold uppercase tracking-wider text-reed-700">Fish farming, started right</p>
          <h1 className="mt-2 max-w-3xl text-3xl font-semibold text-silt-950 sm:text-4xl">
            Shoal connects new fish farmers with trusted tank builders and fingerling hatcheries nearby.
          </h1>
          <p className="mt-4 max-w-2xl text-lg text-silt-700">
            Plan a tank, hire a builder whose work you can see, reserve healthy tilapia or catfish, and pay a deposit that is held until the job is delivered.
          </p>
          <div className="mt-6 flex flex-wrap gap-3">
            <ButtonLink href="/map">Find builders and hatcheries near you</ButtonLink>
            {user ? (
              <ButtonLink href="/dashboard" variant="secondary">
                Go to my Shoal
              </ButtonLink>
            ) : (
              <>
                <ButtonLink href="/sign-up" variant="secondary">
                  Create a free account
                </ButtonLink>
              </>
            )}
            <ButtonLink href="/planner" variant="secondary">
              Plan a tank
            </ButtonLink>
            <ButtonLink href="#how-it-works" variant="ghost">
              How it works
            </ButtonLink>
          </div>
        </div>
      </section>

      <section className="mx-auto max-w-6xl px-4 py-10" aria-labelledby="who">
        <h2 id="who" className="text-xl font-semibold text-silt-950">
          Who Shoal is for
        </h2>
        <div className="mt-4 grid gap-4 sm:grid-cols-3">
          {ROLES.map((r) => (
            <div key={r.title} className="rounded-card border border-silt-200 bg-white p-5">
              <h3 className="font-semibold text-lagoon-800">{r.title}</h3>
              <p className="mt-1 text-sm text-silt-700">{r.body}</p>
            </div>
          ))}
        </div>
      </section>

      <section id="how-it-works" className="mx-auto max-w-6xl px-4 py-6" aria-labelledby="how">
        <h2 id="how" className="text-xl font-semibold text-silt-950">
          From empty yard to first harvest
        </h2>
        <ol className="mt-4 grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
          {STEPS.map((s, i) => (
            <li key={s.title} className="flex gap-3 rounded-card border border-silt-200 bg-white p-5">
              <span className="flex h-8 w-8 shrink-0 items-center justify-center rounded-full bg-reed-100 font-semibold text-reed-800">{i + 1}</span>
              <div>
                <h3 className="font-semibold text-silt-900">{s.title}</h3>
                <p className="mt-1 text-sm text-silt-700">{s.body}</p>
              </div>
            </li>
          ))}
        </ol>
        <p className="mt-6 text-sm text-silt-700">
          Water, weight and electricity can hurt people. Read{" "}
          <Link href="/safety" className="font-medium text-lagoon-700 underline underline-offset-2">
            safety around tanks and pumps
          </Link>{" "}
          before you build.
        </p>
      </section>
    </div>
  );
}
