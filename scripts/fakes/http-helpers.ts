// Small helpers shared by the local stand-ins (mail and payments). Only node: built-ins.
import { randomBytes } from "node:crypto";
import { mkdirSync, renameSync, writeFileSync } from "node:fs";
import type { IncomingMessage, Server, ServerResponse } from "node:http";
import { dirname } from "node:path";
import { pathToFileURL } from "node:url";
import { realpathSync } from "node:fs";

/** Largest request body a stand-in accepts; both real services cap bodies far above what the app sends. */
export const MAX_BODY_BYTES = 1_000_000;

export class BodyTooLargeError extends Error {
  constructor() {
    super(`request body larger than ${MAX_BODY_BYTES} bytes`);
    this.name = "BodyTooLargeError";
  }
}

export function readBody(req: IncomingMessage): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    let tooLarge = false;
    req.on("data", (chunk: Buffer) => {
      size += chunk.length;
      if (size > MAX_BODY_BYTES) {
        // Keep draining so the client sees our reply rather than a reset socket.
        tooLarge = true;
        return;
      }
      chunks.push(chunk);
    });
    req.on("end", () => {
      if (tooLarge) reject(new BodyTooLargeError());
      else resolve(Buffer.concat(chunks).toString("utf8"));
    });
    req.on("error", reject);
  });
}

export function sendJson(
  res: ServerResponse,
  status: number,
  body: unknown,
  headers: Record<string, string> = {},
): void {
  const payload = JSON.stringify(body);
  res.writeHead(status, {
    "Content-Type": "application/json; charset=utf-8",
    "Content-Length": Buffer.byteLength(payload).toString(),
    ...headers,
  });
  res.end(payload);
}

/** Bearer token from the Authorization header, or null when absent or not a Bearer scheme. */
export function bearerToken(req: IncomingMessage): string | null {
  const header = req.headers.authorization;
  if (typeof header !== "string") return null;
  const match = /^Bearer\s+(\S+)\s*$/i.exec(header);
  return match?.[1] ?? null;
}

/** One value of a request header (Node gives string[] for repeated headers; the first wins). */
export function headerValue(req: IncomingMessage, name: string): string | undefined {
  const value = req.headers[name.toLowerCase()];
  return Array.isArray(value) ? value[0] : value;
}

/**
 * Write a file so that a crash never leaves a half-written one behind: write a temp file beside it,
 * then rename over the target (rename is atomic within one POSIX file system).
 */
export function writeFileAtomic(path: string, contents: string): void {
  mkdirSync(dirname(path), { recursive: true });
  const tmp = `${path}.${process.pid}.${randomBytes(6).toString("hex")}.tmp`;
  writeFileSync(tmp, contents, { encoding: "utf8", mode: 0o600 });
  renameSync(tmp, path);
}

export function listen(server: Server, port: number, host: string): Promise<string> {
  return new Promise((resolve, reject) => {
    const onError = (err: Error) => reject(err);
    server.once("error", onError);
    server.listen(port, host, () => {
      server.off("error", onError);
      const address = server.address();
      if (address === null || typeof address === "string") {
        reject(new Error("server did not bind to a TCP port"));
        return;
      }
      // IPv6 literals need brackets in a URL.
      const hostPart = address.family === "IPv6" ? `[${address.address}]` : address.address;
      resolve(`http://${hostPart}:${address.port}`);
    });
  });
}

export function closeServer(server: Server): Promise<void> {
  return new Promise((resolve, reject) => {
    server.close((err) => (err ? reject(err) : resolve()));
    // fetch() keeps sockets alive; without this close() waits for them to time out.
    server.closeAllConnections();
  });
}

/** True when the module at `moduleUrl` is the script Node (or tsx) was asked to run. */
export function isMainModule(moduleUrl: string): boolean {
  const entry = process.argv[1];
  if (entry === undefined) return false;
  try {
    return pathToFileURL(realpathSync(entry)).href === moduleUrl;
  } catch {
    // argv[1] is not a file (e.g. `node -e`): not run directly.
    return false;
  }
}

export function parsePort(value: string | undefined, fallback: number): number {
  if (value === undefined || value === "") return fallback;
  const port = Number(value);
  if (!Number.isInteger(port) || port < 0 || port > 65_535) {
    throw new Error(`invalid port: ${value}`);
  }
  return port;
}
