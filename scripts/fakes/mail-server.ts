// Local stand-in for the hosted e-mail service: speaks the part of the Resend HTTP API that the
// `resend` SDK (6.38.0) uses to send and read e-mails, plus a dev outbox (list newest first, clear).
// Each message is a JSON file under dataDir so the outbox survives restarts.
import { createHash, randomUUID } from "node:crypto";
import { mkdirSync, readdirSync, readFileSync, rmSync } from "node:fs";
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
  writeFileAtomic,
} from "./http-helpers";

export interface MailServerOptions {
  port: number;
  host?: string;
  dataDir: string;
  /** When set, only this key is accepted; otherwise any non-empty Bearer key is. */
  apiKey?: string;
}

export interface RunningMailServer {
  url: string;
  close(): Promise<void>;
}

/** What GET /emails/:id returns; mirrors the SDK's GetEmailResponseSuccess. */
export interface StoredEmail {
  object: "email";
  id: string;
  from: string;
  to: string[];
  cc: string[] | null;
  bcc: string[] | null;
  reply_to: string[] | null;
  subject: string;
  html: string | null;
  text: string | null;
  tags: { name: string; value: string }[];
  created_at: string;
  scheduled_at: string | null;
  last_event: "delivered";
  message_id: string;
}

interface MessageFile {
  // Orders messages created in the same millisecond; kept out of the API shape.
  sequence: number;
  email: StoredEmail;
}

interface IdempotencyFile {
  key: string;
  requestHash: string;
  emailId: string;
  createdAtMs: number;
}

type ErrorName =
  | "missing_api_key"
  | "invalid_api_key"
  | "validation_error"
  | "missing_required_field"
  | "invalid_idempotency_key"
  | "invalid_idempotent_request"
  | "not_found"
  | "method_not_allowed"
  | "internal_server_error";

class MailApiError extends Error {
  constructor(
    readonly statusCode: number,
    readonly errorName: ErrorName,
    message: string,
  ) {
    super(message);
  }
}

// Resend documents idempotency keys as 1–256 characters, remembered for 24 hours (from memory).
const IDEMPOTENCY_KEY_MAX = 256;
const IDEMPOTENCY_TTL_MS = 24 * 60 * 60 * 1000;
// Resend caps recipients per field at 50 (from memory).
const MAX_RECIPIENTS = 50;

// Deliberately loose: the real service accepts `a@b.c` or `Name <a@b.c>`; we only catch obvious slips.
const ADDRESS = /^[^\s@<>]+@[^\s@<>]+\.[^\s@<>]+$/;
const NAMED_ADDRESS = /^[^<>]*<([^\s@<>]+@[^\s@<>]+\.[^\s@<>]+)>$/;
// Resend: tag names and values may hold only ASCII letters, digits, underscores and dashes, ≤ 256 chars.
const TAG_PART = /^[A-Za-z0-9_-]{1,256}$/;

function isAddress(value: string): boolean {
  const trimmed = value.trim();
  return ADDRESS.test(trimmed) || NAMED_ADDRESS.test(trimmed);
}

function formatError(field: string): string {
  return `Invalid \`${field}\` field. The email address needs to follow the \`email@example.com\` or \`Name <email@example.com>\` format.`;
}

function requireString(body: Record<string, unknown>, field: string): string {
  const value = body[field];
  if (value === undefined || value === null || value === "") {
    throw new MailApiError(422, "missing_required_field", `Missing \`${field}\` field.`);
  }
  if (typeof value !== "string") {
    throw new MailApiError(422, "validation_error", `The \`${field}\` field must be a \`string\`.`);
  }
  return value;
}

function optionalString(body: Record<string, unknown>, field: string): string | null {
  const value = body[field];
  if (value === undefined || value === null) return null;
  if (typeof value !== "string") {
    throw new MailApiError(422, "validation_error", `The \`${field}\` field must be a \`string\`.`);
  }
  return value;
}

function addressList(body: Record<string, unknown>, field: string, required: boolean): string[] | null {
  const value = body[field];
  if (value === undefined || value === null || (Array.isArray(value) && value.length === 0) || value === "") {
    if (required) throw new MailApiError(422, "missing_required_field", `Missing \`${field}\` field.`);
    return null;
  }
  const list: unknown[] = Array.isArray(value) ? value : [value];
  if (list.length > MAX_RECIPIENTS) {
    throw new MailApiError(422, "validation_error", `The \`${field}\` field must contain at most ${MAX_RECIPIENTS} addresses.`);
  }
  return list.map((entry) => {
    if (typeof entry !== "string" || !isAddress(entry)) {
      throw new MailApiError(422, "validation_error", formatError(field));
    }
    return entry.trim();
  });
}

function parseTags(body: Record<string, unknown>): { name: string; value: string }[] {
  const value = body.tags;
  if (value === undefined || value === null) return [];
  if (!Array.isArray(value)) {
    throw new MailApiError(422, "validation_error", "The `tags` field must be an `array`.");
  }
  return value.map((tag: unknown) => {
    if (typeof tag !== "object" || tag === null) {
      throw new MailApiError(422, "validation_error", "Each tag must be an object with `name` and `value`.");
    }
    const { name, value: tagValue } = tag as Record<string, unknown>;
    if (typeof name !== "string" || !TAG_PART.test(name) || typeof tagValue !== "string" || !TAG_PART.test(tagValue)) {
      throw new MailApiError(
        422,
        "validation_error",
        "Tags should only contain ASCII letters (a–z, A–Z), numbers (0–9), underscores (_), or dashes (-), and be at most 256 characters.",
      );
    }
    return { name, value: tagValue };
  });
}

/** Validates a POST /emails body into the stored shape (without id and times). */
function parseSendBody(raw: string): Omit<StoredEmail, "id" | "created_at" | "message_id"> {
  let parsed: unknown;
  try {
    parsed = JSON.parse(raw);
  } catch {
    throw new MailApiError(422, "validation_error", "The request body is not valid JSON.");
  }
  if (typeof parsed !== "object" || parsed === null || Array.isArray(parsed)) {
    throw new MailApiError(422, "validation_error", "The request body must be a JSON object.");
  }
  const body = parsed as Record<string, unknown>;
  const from = requireString(body, "from");
  if (!isAddress(from)) throw new MailApiError(422, "validation_error", formatError("from"));
  const to = addressList(body, "to", true) ?? [];
  const subject = requireString(body, "subject");
  // An empty body part counts as absent: there would be nothing to deliver.
  const html = optionalString(body, "html") || null;
  const text = optionalString(body, "text") || null;
  if (html === null && text === null) {
    throw new MailApiError(422, "missing_required_field", "Missing `html` or `text` field.");
  }
  return {
    object: "email",
    from: from.trim(),
    to,
    cc: addressList(body, "cc", false),
    bcc: addressList(body, "bcc", false),
    reply_to: addressList(body, "reply_to", false),
    subject,
    html,
    text,
    tags: parseTags(body),
    scheduled_at: optionalString(body, "scheduled_at"),
    last_event: "delivered",
  };
}

class Outbox {
  private readonly messagesDir: string;
  private readonly idempotencyDir: string;
  private sequence: number;

  constructor(dataDir: string) {
    this.messagesDir = join(dataDir, "messages");
    this.idempotencyDir = join(dataDir, "idempotency");
    mkdirSync(this.messagesDir, { recursive: true });
    mkdirSync(this.idempotencyDir, { recursive: true });
    this.sequence = this.readAll().reduce((max, file) => Math.max(max, file.sequence), 0);
  }

  // All file work below is synchronous on purpose: one request's check-then-write cannot interleave
  // with another's, so two requests with the same idempotency key never both create a message.
  private readAll(): MessageFile[] {
    const files: MessageFile[] = [];
    for (const name of readdirSync(this.messagesDir)) {
      if (!name.endsWith(".json")) continue;
      files.push(JSON.parse(readFileSync(join(this.messagesDir, name), "utf8")) as MessageFile);
    }
    return files;
  }

  list(): StoredEmail[] {
    return this.readAll()
      .sort((a, b) => b.sequence - a.sequence)
      .map((file) => file.email);
  }

  get(id: string): StoredEmail | null {
    // ids are uuids we minted; anything else cannot name a file of ours (and must not escape the folder).
    if (!/^[0-9a-f-]{36}$/.test(id)) return null;
    try {
      return (JSON.parse(readFileSync(join(this.messagesDir, `${id}.json`), "utf8")) as MessageFile).email;
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === "ENOENT") return null;
      throw err;
    }
  }

  /** Stores the message, or replays the earlier one for a reused idempotency key. */
  send(
    draft: Omit<StoredEmail, "id" | "created_at" | "message_id">,
    idempotency: { scope: string; key: string; requestHash: string } | null,
  ): StoredEmail {
    let idempotencyPath: string | null = null;
    if (idempotency !== null) {
      const digest = createHash("sha256").update(`${idempotency.scope}\n${idempotency.key}`).digest("hex");
      idempotencyPath = join(this.idempotencyDir, `${digest}.json`);
      const earlier = this.readIdempotency(idempotencyPath);
      if (earlier !== null && Date.now() - earlier.createdAtMs < IDEMPOTENCY_TTL_MS) {
        if (earlier.requestHash !== idempotency.requestHash) {
          throw new MailApiError(
            409,
            "invalid_idempotent_request",
            "Same idempotency key used with a different request payload. Change your idempotency key or payload.",
          );
        }
        const email = this.get(earlier.emailId);
        // The outbox may have been cleared since; the key then starts afresh.
        if (email !== null) return email;
      }
    }
    const id = randomUUID();
    const email: StoredEmail = {
      ...draft,
      id,
      created_at: new Date().toISOString(),
      message_id: `<${id}@mail-fake.local>`,
    };
    this.sequence += 1;
    const file: MessageFile = { sequence: this.sequence, email };
    writeFileAtomic(join(this.messagesDir, `${id}.json`), JSON.stringify(file, null, 2));
    if (idempotency !== null && idempotencyPath !== null) {
      const record: IdempotencyFile = {
        key: idempotency.key,
        requestHash: idempotency.requestHash,
        emailId: id,
        createdAtMs: Date.now(),
      };
      writeFileAtomic(idempotencyPath, JSON.stringify(record));
    }
    return email;
  }

  clear(): number {
    const count = readdirSync(this.messagesDir).filter((name) => name.endsWith(".json")).length;
    rmSync(this.messagesDir, { recursive: true, force: true });
    rmSync(this.idempotencyDir, { recursive: true, force: true });
    mkdirSync(this.messagesDir, { recursive: true });
    mkdirSync(this.idempotencyDir, { recursive: true });
    return count;
  }

  private readIdempotency(path: string): IdempotencyFile | null {
    try {
      return JSON.parse(readFileSync(path, "utf8")) as IdempotencyFile;
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === "ENOENT") return null;
      throw err;
    }
  }
}

function authenticate(req: IncomingMessage, apiKey: string | undefined): string {
  const token = bearerToken(req);
  if (token === null) {
    throw new MailApiError(
      401,
      "missing_api_key",
      "Missing API key in the authorization header. Include the following header `Authorization: Bearer YOUR_API_KEY` in the request.",
    );
  }
  if (apiKey !== undefined && token !== apiKey) {
    // The hosted service answers an unknown key with 403 (from memory).
    throw new MailApiError(403, "invalid_api_key", "API key is invalid");
  }
  return token;
}

function toListItem(email: StoredEmail) {
  return {
    id: email.id,
    from: email.from,
    to: email.to,
    cc: email.cc,
    bcc: email.bcc,
    reply_to: email.reply_to,
    subject: email.subject,
    created_at: email.created_at,
    scheduled_at: email.scheduled_at,
    last_event: email.last_event,
    message_id: email.message_id,
    // Not in the hosted list shape; the dev outbox shows bodies without a second request.
    html: email.html,
    text: email.text,
    tags: email.tags,
  };
}

async function handle(req: IncomingMessage, res: ServerResponse, outbox: Outbox, apiKey: string | undefined) {
  const url = new URL(req.url ?? "/", "http://localhost");
  const path = url.pathname.replace(/\/+$/, "") || "/";
  const method = req.method ?? "GET";

  if (path === "/health" && method === "GET") {
    sendJson(res, 200, { ok: true });
    return;
  }

  if (path === "/emails") {
    const token = authenticate(req, apiKey);
    if (method === "POST") {
      const raw = await readBody(req);
      const draft = parseSendBody(raw);
      const key = headerValue(req, "idempotency-key");
      let idempotency: { scope: string; key: string; requestHash: string } | null = null;
      if (key !== undefined) {
        if (key.length < 1 || key.length > IDEMPOTENCY_KEY_MAX) {
          throw new MailApiError(
            400,
            "invalid_idempotency_key",
            `The key must be between 1-${IDEMPOTENCY_KEY_MAX} chars.`,
          );
        }
        // Hash the parsed message, not the raw bytes, so key order or whitespace does not count as a change.
        const requestHash = createHash("sha256").update(JSON.stringify(draft)).digest("hex");
        idempotency = { scope: token, key, requestHash };
      }
      const email = outbox.send(draft, idempotency);
      sendJson(res, 200, { id: email.id });
      return;
    }
    if (method === "GET") {
      const to = url.searchParams.get("to");
      const limitParam = url.searchParams.get("limit");
      let emails = outbox.list();
      // `to` is a dev-outbox extension so tests can find one recipient's mail.
      if (to !== null) {
        const wanted = to.toLowerCase();
        emails = emails.filter((email) => email.to.some((address) => address.toLowerCase().includes(wanted)));
      }
      let hasMore = false;
      if (limitParam !== null) {
        const limit = Number(limitParam);
        // Resend's list accepts limit 1–100 (from memory).
        if (!Number.isInteger(limit) || limit < 1 || limit > 100) {
          throw new MailApiError(422, "validation_error", "The `limit` parameter must be an integer between 1 and 100.");
        }
        hasMore = emails.length > limit;
        emails = emails.slice(0, limit);
      }
      sendJson(res, 200, { object: "list", has_more: hasMore, data: emails.map(toListItem) });
      return;
    }
    if (method === "DELETE") {
      const deleted = outbox.clear();
      sendJson(res, 200, { object: "list", deleted });
      return;
    }
    throw new MailApiError(405, "method_not_allowed", "Method is not allowed for the requested path.");
  }

  const match = /^\/emails\/([^/]+)$/.exec(path);
  if (match !== null) {
    authenticate(req, apiKey);
    if (method !== "GET") {
      throw new MailApiError(405, "method_not_allowed", "Method is not allowed for the requested path.");
    }
    const email = outbox.get(decodeURIComponent(match[1] ?? ""));
    if (email === null) throw new MailApiError(404, "not_found", "Email not found");
    sendJson(res, 200, email);
    return;
  }

  throw new MailApiError(404, "not_found", "The requested endpoint does not exist.");
}

export async function startMailServer(options: MailServerOptions): Promise<RunningMailServer> {
  const { port, host = "127.0.0.1", dataDir, apiKey } = options;
  const outbox = new Outbox(resolve(dataDir));
  const server = createServer((req, res) => {
    handle(req, res, outbox, apiKey).catch((err: unknown) => {
      if (err instanceof MailApiError) {
        sendJson(res, err.statusCode, { statusCode: err.statusCode, name: err.errorName, message: err.message });
      } else if (err instanceof BodyTooLargeError) {
        sendJson(res, 413, { statusCode: 413, name: "validation_error", message: err.message });
      } else {
        console.error("[mail-fake] unexpected error", err);
        if (!res.headersSent) {
          sendJson(res, 500, { statusCode: 500, name: "internal_server_error", message: "Unexpected error in the mail stand-in." });
        } else {
          res.destroy();
        }
      }
    });
  });
  const url = await listen(server, port, host);
  return { url, close: () => closeServer(server) };
}

if (isMainModule(import.meta.url)) {
  const port = parsePort(process.env.MAIL_FAKE_PORT, 4610);
  const dataDir = process.env.MAIL_FAKE_DATA ?? "./data/mail";
  const running = await startMailServer({ port, host: process.env.MAIL_FAKE_HOST ?? "127.0.0.1", dataDir, apiKey: process.env.MAIL_FAKE_API_KEY || undefined });
  console.log(`[mail-fake] listening on ${running.url} (data in ${resolve(dataDir)})`);
  const stop = () => {
    running.close().then(
      () => process.exit(0),
      (err: unknown) => {
        console.error("[mail-fake] error while closing", err);
        process.exit(1);
      },
    );
  };
  process.once("SIGINT", stop);
  process.once("SIGTERM", stop);
}
