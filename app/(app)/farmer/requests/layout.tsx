import { requirePagePermission } from "@/lib/auth/session";

// The guard sits in the layout, outside the segment's loading boundary, so that a redirect or 403 is a real HTTP status.
export default async function Guard({ children }: { children: React.ReactNode }) {
  await requirePagePermission("tank-request:post", "/farmer/requests");
  return children;
}
