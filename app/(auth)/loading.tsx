import { PageSkeleton } from "@/components/ui/page-skeleton";

// Safe here: no sign-in page answers 404, so this boundary cannot turn one into a 200.
export default function Loading() {
  return <PageSkeleton shape="form" />;
}
