import type { ApiResult } from "@/lib/api/client";

/**
 * Idempotency keys for one form: a retry of the same request after no answer (offline, or a server error) reuses
 * the key, so the server acts once; any other submission gets a new key.
 */
export class AttemptKeys {
  private last: { body: string; key: string; answered: boolean } | null = null;

  keyFor(body: unknown): string {
    const json = JSON.stringify(body);
    if (this.last && this.last.body === json && !this.last.answered) return this.last.key;
    this.last = { body: json, key: crypto.randomUUID(), answered: false };
    return this.last.key;
  }

  settle(result: ApiResult<unknown>): void {
    if (this.last) this.last.answered = result.ok || (result.status >= 400 && result.status < 500);
  }
}
