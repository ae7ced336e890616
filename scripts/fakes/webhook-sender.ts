// Signs and delivers events the way Stripe does: a JSON body, and a `Stripe-Signature: t=<unix>,v1=<hex>`
// header where v1 = HMAC-SHA256(secret, `${t}.${body}`) (docs.stripe.com/webhooks#verify-manually; the same
// scheme node_modules/stripe/esm/Webhooks.js verifies). Failed deliveries are retried with backoff.
import { createHmac } from "node:crypto";

export function signPayload(payload: string, secret: string, timestampSec: number): string {
  const signature = createHmac("sha256", secret).update(`${timestampSec}.${payload}`, "utf8").digest("hex");
  return `t=${timestampSec},v1=${signature}`;
}

export interface DeliveryAttempt {
  status: number | null;
  error: string | null;
}

export interface WebhookSenderOptions {
  url: string;
  secret: string;
  /** Waits before each retry; the number of entries is the number of retries. */
  retryDelaysMs: readonly number[];
  timeoutMs: number;
  onAttempt(eventId: string, attempt: DeliveryAttempt, finished: boolean): void;
}

export class WebhookSender {
  private readonly timers = new Set<NodeJS.Timeout>();
  private readonly inFlight = new Set<AbortController>();
  private closed = false;

  constructor(private readonly options: WebhookSenderOptions) {}

  /** Delivers `payload` (the exact bytes that get signed), retrying on network errors and non-2xx replies. */
  deliver(eventId: string, payload: string, attemptsSoFar = 0): void {
    void this.attempt(eventId, payload, attemptsSoFar);
  }

  private async attempt(eventId: string, payload: string, attemptIndex: number): Promise<void> {
    if (this.closed) return;
    const controller = new AbortController();
    this.inFlight.add(controller);
    const timeout = setTimeout(() => controller.abort(), this.options.timeoutMs);
    let result: DeliveryAttempt;
    try {
      const response = await fetch(this.options.url, {
        method: "POST",
        headers: {
          "Content-Type": "application/json; charset=utf-8",
          "User-Agent": "Stripe/1.0 (+https://stripe.com/docs/webhooks)",
          "Stripe-Signature": signPayload(payload, this.options.secret, Math.floor(Date.now() / 1000)),
        },
        body: payload,
        signal: controller.signal,
      });
      // Drain the body so the socket can be reused or closed.
      await response.arrayBuffer();
      result = { status: response.status, error: response.ok ? null : `HTTP ${response.status}` };
    } catch (err) {
      result = { status: null, error: err instanceof Error ? err.message : String(err) };
    } finally {
      clearTimeout(timeout);
      this.inFlight.delete(controller);
    }
    if (this.closed) return;
    const delivered = result.error === null;
    const delay = this.options.retryDelaysMs[attemptIndex];
    const finished = delivered || delay === undefined;
    this.options.onAttempt(eventId, result, finished);
    if (finished) {
      if (!delivered) console.warn(`[payments-fake] giving up on ${eventId} after ${attemptIndex + 1} attempts: ${result.error}`);
      return;
    }
    const timer = setTimeout(() => {
      this.timers.delete(timer);
      void this.attempt(eventId, payload, attemptIndex + 1);
    }, delay);
    this.timers.add(timer);
  }

  close(): void {
    this.closed = true;
    for (const timer of this.timers) clearTimeout(timer);
    this.timers.clear();
    for (const controller of this.inFlight) controller.abort();
    this.inFlight.clear();
  }
}
