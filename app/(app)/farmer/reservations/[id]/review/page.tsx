import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { ReviewFormPage } from "@/components/reviews/review-form-page";
import { requirePagePermission } from "@/lib/auth/session";
import { NotFound } from "@/lib/errors";
import { getReservationDetail } from "@/lib/reservations/queries";

export const metadata: Metadata = { title: "Review the hatchery" };

// The segment's layout has already required a farmer; the reservation must be this farmer's.
export default async function ReviewReservationPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePagePermission("review:write", `/farmer/reservations/${id}/review`);
  const reservation = await getReservationDetail(user, id).catch((error: unknown) => {
    if (error instanceof NotFound) return null;
    throw error;
  });
  if (!reservation || reservation.viewerRole !== "farmer") notFound();
  return <ReviewFormPage userId={user.id} subjectKind="reservation" subjectId={reservation.id} backHref={`/farmer/reservations/${id}`} backLabel="Back to the reservation" />;
}
