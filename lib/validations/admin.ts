import { z } from "zod";

export const verificationDecisionSchema = z.object({
  decision: z.enum(["verified", "rejected"], { error: "Decision must be verified or rejected" }),
  note: z.string().trim().max(500, "At most 500 characters").optional(),
});
