import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { PageHeading } from "@/components/ui/card";
import { requirePagePermission } from "@/lib/auth/session";
import { NotFound } from "@/lib/errors";
import { toMajor } from "@/lib/money/money";
import { getOwnBatch, type OwnBatch } from "@/lib/reservations/batches";
import { BatchForm } from "../../_components/batch-form";

export const metadata: Metadata = { title: "Edit batch" };

export default async function EditBatchPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePagePermission("batch:manage", `/hatchery/batches/${id}/edit`);
  let b: OwnBatch;
  try {
    b = await getOwnBatch(user, id);
  } catch (error) {
    if (error instanceof NotFound) notFound();
    throw error;
  }
  if (b.state === "closed") notFound();
  return (
    <div className="mx-auto max-w-2xl">
      <PageHeading title="Edit batch" lead="Changes apply to new reservations; those already made keep their price and count." />
      <BatchForm
        batchId={b.id}
        initial={{
          species: b.species,
          meanWeightG: String(b.meanWeightG),
          meanLengthCm: String(b.meanLengthCm),
          countAvailable: String(b.countAvailable),
          pricePerFish: String(toMajor(b.priceMinor, b.currency)),
          currency: b.currency,
          readyFrom: b.readyFrom.slice(0, 10),
          sellBy: b.sellBy.slice(0, 10),
          delivery: b.delivery,
        }}
      />
    </div>
  );
}
