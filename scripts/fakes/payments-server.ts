// Local stand-in for the card processor: speaks the subset of the Stripe v1 API that lib/payments uses
// (payment intents with manual capture, refunds, events) to the official `stripe` SDK, honours
// Idempotency-Key like Stripe, persists its state under dataDir and delivers signed webhooks.
import { createHash } from "node:crypto";
import { createServer, type IncomingMessage, type ServerResponse } from "node:http";
import { join, resolve } from "node:path";
import {
  BodyTooLargeError,
  bearerToken,
  closeServer,
  headerValue,
  isMainModule,
  listen,
  parsePort,
  readBody,
  sendJson,
} from "./http-helpers";
import { PaymentsEngine, type EngineResult, type RequestContext } from "./payments-engine";
import { emptyState, loadState, newId, saveState, type EventRecord, type PaymentsState } from "./payments-store";
import { canonicalForm, decodeForm, FormDecodeError, type FormObject } from "./stripe-form";
import { StripeApiError, invalidParam, optionalInteger, stringList } from "./stripe-params";
import { WebhookSender } from "./webhook-sender";

export interface PaymentsServerOptions {
  port: number;
  host?: string;
  dataDir: string;
  secretKey: string;
  /** Where events are POSTed; leave out to only record them (GET /_fake/events). */
  webhookUrl?: string;
  webhookSecret: string;
  /** Waits before each webhook retry (default 1 s, 2 s, 4 s, 8 s: five attempts in all). */
  webhookRetryDelaysMs?: readonly number[];
  webhookTimeoutMs?: number;
}

export interface RunningPaymentsServer {
  url: string;
  close(): Promise<void>;
}

// Stripe keeps idempotency keys for at least 24 hours (docs.stripe.com/api/idempotent_requests).
const IDEMPOTENCY_TTL_MS = 24 * 60 * 60 * 1000;
// Stripe allows keys of up to 255 characters (docs.stripe.com/api/idempotent_requests).
const IDEMPOTENCY_KEY_MAX = 255;
const DEFAULT_RETRY_DELAYS_MS = [1_000, 2_000, 4_000, 8_000] as const;

function maskKey(key: string): string {
  return key.length <= 12 ? "****" : `${key.slice(0, 8)}${"*".repeat(key.length - 12)}${key.slice(-4)}`;
}

function authenticate(req: IncomingMessage, secretKey: string): string {
  const token = bearerToken(req);
  if (token === null) {
    throw new StripeApiError(
      401,
      {
        type: "invalid_request_error",
        message:
          "You did not provide an API key. You need to provide your API key in the Authorization header, using Bearer auth (e.g. 'Authorization: Bearer YOUR_SECRET_KEY').",
      },
      true,
    );
  }
  if (token !== secretKey) {
    throw new StripeApiError(
      401,
      { type: "invalid_request_error", code: "api_key_invalid", message: `Invalid API Key provided: ${maskKey(token)}` },
      true,
    );
  }
  return token;
}

function parseForm(text: string): FormObject {
  try {
    return decodeForm(text);
  } catch (err) {
    if (err instanceof FormDecodeError) throw invalidParam(err.message, err.param);
    throw err;
  }
}

function eventPayload(record: EventRecord): string {
  // Stripe sends events pretty-printed; what matters is that the signed bytes are the sent bytes.
  return JSON.stringify(record.event, null, 2);
}

class PaymentsService {
  private readonly statePath: string;
  private state: PaymentsState;
  private engine: PaymentsEngine;
  private readonly sender: WebhookSender | null;

  constructor(private readonly options: PaymentsServerOptions) {
    this.statePath = join(resolve(options.dataDir), "state.json");
    this.state = loadState(this.statePath);
    this.engine = new PaymentsEngine(this.state, options.webhookUrl !== undefined);
    this.sender =
      options.webhookUrl === undefined
        ? null
        : new WebhookSender({
            url: options.webhookUrl,
            secret: options.webhookSecret,
            retryDelaysMs: options.webhookRetryDelaysMs ?? DEFAULT_RETRY_DELAYS_MS,
            timeoutMs: options.webhookTimeoutMs ?? 10_000,
            onAttempt: (eventId, attempt) => this.recordAttempt(eventId, attempt.status, attempt.error),
          });
    saveState(this.statePath, this.state);
  }

  /** Resumes deliveries that were still pending when the server last stopped. */
  resumeDeliveries(): void {
    const retries = this.options.webhookRetryDelaysMs ?? DEFAULT_RETRY_DELAYS_MS;
    for (const record of this.state.events) {
      if (!record.delivery.delivered && record.delivery.attempts <= retries.length) {
        this.sender?.deliver(record.event.id, eventPayload(record), record.delivery.attempts);
      }
    }
  }

  close(): void {
    this.sender?.close();
  }

  async handle(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const url = new URL(req.url ?? "/", "http://localhost");
    const path = url.pathname.replace(/\/+$/, "") || "/";
    const method = req.method ?? "GET";
    const requestId = newId("req", 14);
    const apiVersion = headerValue(req, "stripe-version") ?? null;
    const headers: Record<string, string> = { "Request-Id": requestId };
    if (apiVersion !== null) headers["Stripe-Version"] = apiVersion;

    if (path === "/health" && method === "GET") {
      sendJson(res, 200, { ok: true }, headers);
      return;
    }
    try {
      const token = authenticate(req, this.options.secretKey);
      const bodyText = method === "POST" ? await readBody(req) : "";
      const params = method === "POST" ? parseForm(bodyText) : parseForm(url.search.slice(1));
      const key = method === "POST" ? (headerValue(req, "idempotency-key") ?? null) : null;
      if (key !== null) headers["Idempotency-Key"] = key;
      const ctx: RequestContext = { requestId, idempotencyKey: key, apiVersion };

      if (path.startsWith("/_fake/")) {
        this.handleFake(method, path, url, res, headers);
        return;
      }
      const route = this.route(method, path, params, ctx);
      if (key === null) {
        this.finish(route(), res, headers);
        return;
      }
      this.withIdempotency(token, key, method, path, params, route, res, headers);
    } catch (err) {
      if (err instanceof StripeApiError) {
        sendJson(res, err.status, { error: err.body }, headers);
      } else if (err instanceof BodyTooLargeError) {
        sendJson(res, 413, { error: { type: "invalid_request_error", message: err.message } }, headers);
      } else {
        throw err;
      }
    }
  }

  /** Picks the endpoint; the returned thunk runs it (so idempotency can decide whether to). */
  private route(method: string, path: string, params: FormObject, ctx: RequestContext): () => EngineResult {
    const read = (body: unknown) => (): EngineResult => ({ status: 200, body, events: [] });
    if (path === "/v1/payment_intents" && method === "POST") return () => this.engine.createIntent(params, ctx);
    const intentAction = /^\/v1\/payment_intents\/([^/]+)(?:\/(confirm|capture|cancel))?$/.exec(path);
    if (intentAction !== null) {
      const id = decodeURIComponent(intentAction[1] ?? "");
      const action = intentAction[2];
      if (action === undefined && method === "GET") return () => read(this.engine.retrieveIntent(id, stringList(params, "expand")))();
      if (action === "confirm" && method === "POST") return () => this.engine.confirmIntent(id, params, ctx);
      if (action === "capture" && method === "POST") return () => this.engine.captureIntent(id, params, ctx);
      if (action === "cancel" && method === "POST") return () => this.engine.cancelIntent(id, params, ctx);
    }
    if (path === "/v1/refunds" && method === "POST") return () => this.engine.createRefund(params, ctx);
    const single = /^\/v1\/(refunds|charges|events)\/([^/]+)$/.exec(path);
    if (single !== null && method === "GET") {
      const id = decodeURIComponent(single[2] ?? "");
      if (single[1] === "refunds") return () => read(this.engine.retrieveRefund(id))();
      if (single[1] === "charges") return () => read(this.engine.retrieveCharge(id))();
      return () => read(this.findEvent(id).event)();
    }
    if (path === "/v1/events" && method === "GET") {
      const limit = optionalInteger(params, "limit") ?? 10;
      if (limit < 1 || limit > 100) throw invalidParam("Invalid limit: must be between 1 and 100", "limit");
      const newestFirst = [...this.state.events].reverse().map((record) => record.event);
      return read({ object: "list", data: newestFirst.slice(0, limit), has_more: newestFirst.length > limit, url: "/v1/events" });
    }
    throw new StripeApiError(
      404,
      { type: "invalid_request_error", message: `Unrecognized request URL (${method}: ${path}).` },
      true,
    );
  }

  private withIdempotency(
    token: string,
    key: string,
    method: string,
    path: string,
    params: FormObject,
    run: () => EngineResult,
    res: ServerResponse,
    headers: Record<string, string>,
  ): void {
    if (key.length === 0 || key.length > IDEMPOTENCY_KEY_MAX) {
      throw invalidParam(`Idempotency keys must be between 1 and ${IDEMPOTENCY_KEY_MAX} characters.`, "Idempotency-Key");
    }
    const slot = createHash("sha256").update(`${token}\n${key}`).digest("hex");
    const paramsHash = createHash("sha256").update(canonicalForm(params)).digest("hex");
    const earlier = this.state.idempotency[slot];
    if (earlier !== undefined && Date.now() - earlier.createdAtMs < IDEMPOTENCY_TTL_MS) {
      if (earlier.method !== method || earlier.path !== path) {
        throw new StripeApiError(400, {
          type: "idempotency_error",
          message: `Keys for idempotent requests can only be used for the same endpoint they were first used for ('${earlier.method} ${earlier.path}' vs '${method} ${path}'). Try using a key other than '${key}' if you meant to execute a different request.`,
        });
      }
      if (earlier.paramsHash !== paramsHash) {
        throw new StripeApiError(400, {
          type: "idempotency_error",
          message: `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`,
        });
      }
      res.writeHead(earlier.status, {
        "Content-Type": "application/json; charset=utf-8",
        "Content-Length": Buffer.byteLength(earlier.body).toString(),
        "Idempotent-Replayed": "true",
        ...headers,
      });
      res.end(earlier.body);
      return;
    }
    let result: EngineResult;
    try {
      result = run();
    } catch (err) {
      if (err instanceof StripeApiError && !err.beforeExecution) {
        // The endpoint ran and refused: Stripe replays that refusal for the same key.
        this.remember(slot, { method, path, paramsHash, status: err.status, body: JSON.stringify({ error: err.body }) });
        saveState(this.statePath, this.state);
      }
      throw err;
    }
    this.remember(slot, { method, path, paramsHash, status: result.status, body: JSON.stringify(result.body) });
    this.finish(result, res, headers);
  }

  private remember(slot: string, record: { method: string; path: string; paramsHash: string; status: number; body: string }): void {
    const now = Date.now();
    for (const [name, existing] of Object.entries(this.state.idempotency)) {
      if (now - existing.createdAtMs >= IDEMPOTENCY_TTL_MS) delete this.state.idempotency[name];
    }
    this.state.idempotency[slot] = { ...record, createdAtMs: now };
  }

  /** Persists, answers, then hands new events to the webhook sender. */
  private finish(result: EngineResult, res: ServerResponse, headers: Record<string, string>): void {
    saveState(this.statePath, this.state);
    sendJson(res, result.status, result.body, headers);
    for (const record of result.events) this.sender?.deliver(record.event.id, eventPayload(record));
  }

  private findEvent(id: string): EventRecord {
    const record = this.state.events.find((item) => item.event.id === id);
    if (record === undefined) {
      throw new StripeApiError(404, { type: "invalid_request_error", code: "resource_missing", message: `No such event: '${id}'`, param: "id" });
    }
    return record;
  }

  private recordAttempt(eventId: string, status: number | null, error: string | null): void {
    const record = this.state.events.find((item) => item.event.id === eventId);
    if (record === undefined) return;
    record.delivery.attempts += 1;
    record.delivery.lastStatus = status;
    record.delivery.lastError = error;
    record.delivery.lastAttemptAt = new Date().toISOString();
    if (error === null) {
      record.delivery.delivered = true;
    }
    saveState(this.statePath, this.state);
  }

  /** Test and dev helpers outside Stripe's API. */
  private handleFake(method: string, path: string, url: URL, res: ServerResponse, headers: Record<string, string>): void {
    if (path === "/_fake/events" && method === "GET") {
      const type = url.searchParams.get("type");
      const intent = url.searchParams.get("payment_intent");
      const data = [...this.state.events]
        .reverse()
        .filter((record) => (type === null || record.event.type === type) && (intent === null || record.paymentIntent === intent));
      sendJson(res, 200, { object: "list", data }, headers);
      return;
    }
    const redeliver = /^\/_fake\/events\/([^/]+)\/redeliver$/.exec(path);
    if (redeliver !== null && method === "POST") {
      const record = this.findEvent(decodeURIComponent(redeliver[1] ?? ""));
      if (this.sender === null) throw invalidParam("No webhook URL is configured.", "webhookUrl");
      // A manual resend is a fresh delivery of the same event (same id, same body, new signature time).
      this.sender.deliver(record.event.id, eventPayload(record));
      sendJson(res, 202, { id: record.event.id, redelivering: true }, headers);
      return;
    }
    if (path === "/_fake/reset" && method === "POST") {
      // Deliveries still in flight finish harmlessly: their records are gone, so nothing is updated.
      this.state = emptyState();
      this.engine = new PaymentsEngine(this.state, this.options.webhookUrl !== undefined);
      saveState(this.statePath, this.state);
      sendJson(res, 200, { reset: true }, headers);
      return;
    }
    throw new StripeApiError(404, { type: "invalid_request_error", message: `Unrecognized request URL (${method}: ${path}).` }, true);
  }
}

export async function startPaymentsServer(options: PaymentsServerOptions): Promise<RunningPaymentsServer> {
  const { port, host = "127.0.0.1" } = options;
  const service = new PaymentsService(options);
  const server = createServer((req, res) => {
    service.handle(req, res).catch((err: unknown) => {
      console.error("[payments-fake] unexpected error", err);
      if (!res.headersSent) {
        // Stripe's 500s ask the SDK not to retry blindly; its idempotency layer would replay anyway.
        sendJson(res, 500, { error: { type: "api_error", message: "Unexpected error in the payments stand-in." } }, { "Stripe-Should-Retry": "false" });
      } else {
        res.destroy();
      }
    });
  });
  const url = await listen(server, port, host);
  service.resumeDeliveries();
  return {
    url,
    close: async () => {
      service.close();
      await closeServer(server);
    },
  };
}

if (isMainModule(import.meta.url)) {
  const port = parsePort(process.env.PAYMENTS_FAKE_PORT, 4620);
  const dataDir = process.env.PAYMENTS_FAKE_DATA ?? "./data/payments";
  const secretKey = process.env.STRIPE_SECRET_KEY ?? "";
  const webhookSecret = process.env.STRIPE_WEBHOOK_SECRET ?? "";
  if (secretKey === "" || webhookSecret === "") {
    console.error("[payments-fake] STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET must be set (the app uses the same values).");
    process.exit(1);
  }
  const webhookEnv = process.env.PAYMENTS_WEBHOOK_URL;
  // An explicitly empty PAYMENTS_WEBHOOK_URL turns delivery off; unset means the local app.
  const webhookUrl = webhookEnv === undefined ? "http://127.0.0.1:3000/api/webhooks/stripe" : webhookEnv || undefined;
  const running = await startPaymentsServer({ port, host: process.env.PAYMENTS_FAKE_HOST ?? "127.0.0.1", dataDir, secretKey, webhookSecret, webhookUrl });
  console.log(
    `[payments-fake] listening on ${running.url} (data in ${resolve(dataDir)}; webhooks ${webhookUrl ?? "off"})`,
  );
  const stop = () => {
    running.close().then(
      () => process.exit(0),
      (err: unknown) => {
        console.error("[payments-fake] error while closing", err);
        process.exit(1);
      },
    );
  };
  process.once("SIGINT", stop);
  process.once("SIGTERM", stop);
}
