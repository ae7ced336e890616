import type { Metadata } from "next";
import { Suspense } from "react";
import { QueryProvider } from "@/components/query/query-provider";
import { PageSkeleton } from "@/components/ui/page-skeleton";
import { env } from "@/lib/env";
import { Finder } from "./_components/finder";

export const metadata: Metadata = {
  title: "Find builders and hatcheries near you",
  description: "Tank builders and fingerling hatcheries near you, on a map that works offline.",
};

export default function MapPage() {
  return (
    <QueryProvider>
      <Suspense fallback={<PageSkeleton />}>
        <Finder hostedStyleUrl={env.MAP_STYLE_URL ?? null} />
      </Suspense>
    </QueryProvider>
  );
}
