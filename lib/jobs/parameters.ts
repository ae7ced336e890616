import type { ProductParameter } from "@/lib/reservations/parameters";

/* Every deadline and share that shapes a builder's job, in one place, each with its reason. */

export interface JobParameters {
  readonly autoConfirmDays: ProductParameter<"days">;
  readonly depositShareBasisPoints: ProductParameter<"basis points">;
  readonly minCompletionPhotos: ProductParameter<"photos">;
}

// A job's deposit is held from acceptance to completion, often longer than a card authorisation lasts (about
// 7 days; see the note in lib/reservations/parameters.ts). The same open decision applies.
export const JOB_PARAMETERS: JobParameters = {
  autoConfirmDays: {
    value: 7,
    unit: "days",
    basis: "product choice",
    reason:
      "The farmer needs time to fill the new tank and watch it: a leaking liner seam or a cracked wall shows as a falling water level within a few days of filling (common practice). A week covers that, and a builder who did the job waits at most a week after finishing for the deposit. Disputes close at the same moment, so confirmation and dispute can never both win.",
  },
  depositShareBasisPoints: {
    value: 3_000,
    unit: "basis points",
    basis: "product choice",
    reason:
      "30 % of the quote total is held when the farmer accepts. A tank costs far more than a fingerling order, and a new farmer may not have the whole price before the work starts. Holding almost a third shows the builder the farmer is serious before they buy materials and book days. Because the money is held until the farmer confirms, it is also the part of the price the farmer can be sure of getting back if the job goes wrong. The balance is settled on completion.",
  },
  minCompletionPhotos: {
    value: 1,
    unit: "photos",
    basis: "product choice",
    reason:
      "A builder marks the tank built with at least one photo, so the farmer confirms against something and an admin has evidence if there is a dispute.",
  },
};
