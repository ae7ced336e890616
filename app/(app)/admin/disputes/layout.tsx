import { requirePagePermission } from "@/lib/auth/session";

// The guard sits in the layout so a refusal is a real HTTP status before any HTML streams.
export default async function Guard({ children }: { children: React.ReactNode }) {
  await requirePagePermission("admin:resolve-disputes", "/admin/disputes");
  return children;
}
