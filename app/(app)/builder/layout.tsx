import { requirePagePermission } from "@/lib/auth/session";

// The guard sits in the layout, outside the segment's loading boundary, so that a
// redirect or 403 is sent as a real HTTP status before any HTML streams.
export default async function Guard({ children }: { children: React.ReactNode }) {
  await requirePagePermission("builder:manage", "/builder");
  return children;
}
