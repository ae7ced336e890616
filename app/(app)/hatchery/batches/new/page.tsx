import type { Metadata } from "next";
import { PageHeading } from "@/components/ui/card";
import { requirePagePermission } from "@/lib/auth/session";
import { env } from "@/lib/env";
import { BatchForm } from "../_components/batch-form";

export const metadata: Metadata = { title: "Post a batch" };

export default async function NewBatchPage() {
  await requirePagePermission("batch:manage", "/hatchery/batches/new");
  const today = new Date();
  const inDays = (d: number) => new Date(today.getTime() + d * 86_400_000).toISOString().slice(0, 10);
  return (
    <div className="mx-auto max-w-2xl">
      <PageHeading title="Post a batch" lead="Fingerlings you have ready now or soon. Farmers see the count left, the price and the dates." />
      <BatchForm
        initial={{ species: "tilapia", meanWeightG: "", meanLengthCm: "", countAvailable: "", pricePerFish: "", currency: env.DEFAULT_CURRENCY, readyFrom: inDays(0), sellBy: inDays(30), delivery: "pickup" }}
      />
    </div>
  );
}
