import { redirect } from "next/navigation";
import { requirePageUser } from "@/lib/auth/session";

// The guard sits in the layout, outside the segment's loading boundary, so that a
// redirect or 403 is sent as a real HTTP status before any HTML streams.
export default async function Guard({ children }: { children: React.ReactNode }) {
  const user = await requirePageUser("/dashboard");
  if (!user.onboarded && !user.roles.includes("admin")) redirect("/onboarding");
  return children;
}
