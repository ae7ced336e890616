/**
 * An Idempotency-Key claim with no answer this old belongs to a request whose process died (a crash, a kill, a
 * lost machine): the longest legitimate call (a deposit payment waiting on the processor) answers well within it.
 * A retry then takes the claim over and runs again (lib/api/idempotency.ts). Pure, so test tools can import it.
 */
export const STALE_CLAIM_MS = 20_000;
