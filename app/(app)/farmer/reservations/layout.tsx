import { requirePagePermission } from "@/lib/auth/session";

// The guard sits in the layout, outside the segment's loading boundary, so that a redirect or 403 is a real HTTP
// status. Reserving, paying and following reservations are for farmer accounts.
export default async function Guard({ children }: { children: React.ReactNode }) {
  await requirePagePermission("reservation:create", "/farmer/reservations");
  return children;
}
