// A tiny webhook endpoint for tests: records every delivery (raw body and Stripe-Signature) exactly as
// received and answers with a status the test chooses, so retries and signatures can be checked.
import { createServer } from "node:http";
import { closeServer, listen, readBody } from "./http-helpers";

export interface ReceivedDelivery {
  rawBody: string;
  signature: string | undefined;
  /** the status this receiver answered with */
  answered: number;
}

export interface WebhookReceiver {
  url: string;
  deliveries: ReceivedDelivery[];
  /** Resolves with the deliveries once `predicate` holds, or rejects after `timeoutMs`. */
  waitFor(predicate: (deliveries: ReceivedDelivery[]) => boolean, timeoutMs?: number): Promise<ReceivedDelivery[]>;
  close(): Promise<void>;
}

/** `respond` gets the 0-based index of the delivery and returns the HTTP status to answer with. */
export async function startWebhookReceiver(respond: (index: number) => number = () => 200): Promise<WebhookReceiver> {
  const deliveries: ReceivedDelivery[] = [];
  const waiters = new Set<() => void>();
  const server = createServer((req, res) => {
    readBody(req).then(
      (rawBody) => {
        const answered = respond(deliveries.length);
        const header = req.headers["stripe-signature"];
        deliveries.push({ rawBody, signature: Array.isArray(header) ? header[0] : header, answered });
        res.writeHead(answered, { "Content-Type": "application/json" });
        res.end(JSON.stringify({ received: true }));
        for (const wake of waiters) wake();
      },
      (err: unknown) => {
        res.writeHead(400);
        res.end(String(err));
      },
    );
  });
  const url = await listen(server, 0, "127.0.0.1");
  return {
    url: `${url}/webhooks/stripe`,
    deliveries,
    waitFor(predicate, timeoutMs = 5_000) {
      return new Promise((resolvePromise, reject) => {
        const check = () => {
          if (!predicate(deliveries)) return;
          clearTimeout(timer);
          waiters.delete(check);
          resolvePromise(deliveries);
        };
        const timer = setTimeout(() => {
          waiters.delete(check);
          reject(new Error(`webhook receiver: condition not met within ${timeoutMs} ms (${deliveries.length} deliveries)`));
        }, timeoutMs);
        waiters.add(check);
        check();
      });
    },
    close: () => closeServer(server),
  };
}
