import Link from "next/link";
import { requirePagePermission } from "@/lib/auth/session";
import { countOpenDisputes } from "@/lib/disputes/dispute-queue";

// The guard sits in the layout, outside the segment's loading boundary, so that a
// redirect or 403 is sent as a real HTTP status before any HTML streams.
export default async function Guard({ children }: { children: React.ReactNode }) {
  await requirePagePermission("admin:verify-providers", "/admin");
  const disputes = await countOpenDisputes();
  return (
    <>
      <nav aria-label="Admin sections" className="mb-6 flex flex-wrap gap-x-5 gap-y-2 border-b border-silt-200 pb-3 text-sm font-medium">
        <Link href="/admin" className="text-lagoon-700 underline-offset-4 hover:underline">
          Verification and reports
        </Link>
        <Link href="/admin/disputes" className="text-lagoon-700 underline-offset-4 hover:underline">
          Disputes{disputes > 0 ? ` (${disputes} open)` : ""}
        </Link>
      </nav>
      {children}
    </>
  );
}
