import { PageSkeleton } from "@/components/ui/page-skeleton";

// Safe here: the planner page never answers 404 (a missing ?from= plan only shows a notice).
export default function Loading() {
  return <PageSkeleton shape="form" label="Loading the planner…" />;
}
