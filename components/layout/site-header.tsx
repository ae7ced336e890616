import Link from "next/link";
import { getCurrentUser } from "@/lib/auth/session";
import { Logo } from "./logo";
import { SignOutButton } from "./sign-out-button";
import { PUBLIC_NAV } from "./nav";

/*
 * The header's links do not prefetch. It is on every page, and a link to a route with a loading.tsx (sign-in,
 * sign-up, the planner) would otherwise fetch that route's code as soon as it is on screen: about 40 KB gzipped
 * for the two account forms and 45 KB for the planner, on every page view, on data most visitors pay for. A tap
 * fetches the page as a normal client-side navigation, showing its loading state.
 */
export async function SiteHeader() {
  const user = await getCurrentUser();
  return (
    <header className="no-print border-b border-silt-200 bg-white/95">
      <div className="mx-auto flex max-w-6xl items-center gap-3 px-4 py-2">
        <Link href="/" className="flex min-h-11 items-center gap-2 font-display text-lg font-semibold text-lagoon-800">
          <Logo className="h-8 w-8" />
          Shoal
        </Link>
        <nav aria-label="Main" className="ml-2 hidden gap-1 sm:flex">
          {PUBLIC_NAV.map((item) => (
            <Link key={item.href} href={item.href} prefetch={false} className="rounded-lg px-3 py-2 text-sm font-medium text-silt-700 hover:bg-silt-100">
              {item.label}
            </Link>
          ))}
        </nav>
        <div className="ml-auto flex items-center gap-1">
          {user ? (
            <>
              <Link href="/dashboard" className="rounded-lg px-3 py-2 text-sm font-semibold text-lagoon-700 hover:bg-lagoon-50">
                My Shoal
              </Link>
              <SignOutButton />
            </>
          ) : (
            <>
              <Link href="/sign-in" prefetch={false} className="rounded-lg px-3 py-2 text-sm font-medium text-silt-700 hover:bg-silt-100">
                Sign in
              </Link>
              <Link href="/sign-up" prefetch={false} className="rounded-lg bg-lagoon-600 px-3 py-2 text-sm font-semibold text-white hover:bg-lagoon-700">
                Join
              </Link>
            </>
          )}
        </div>
      </div>
      <nav aria-label="Main (small screens)" className="flex gap-1 overflow-x-auto border-t border-silt-100 px-2 py-1 sm:hidden">
        {PUBLIC_NAV.map((item) => (
          <Link key={item.href} href={item.href} prefetch={false} className="whitespace-nowrap rounded-lg px-3 py-2 text-sm font-medium text-silt-700">
            {item.label}
          </Link>
        ))}
      </nav>
    </header>
  );
}
