import "server-only";
import { NextResponse } from "next/server";
import { z } from "zod";
import { env } from "@/lib/env";
import { DomainError, Forbidden, Invalid, TooManyRequests } from "@/lib/errors";

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

function ownOrigins(): Set<string> {
  const u = new URL(env.APP_URL);
  const twin = u.hostname === "localhost" ? "127.0.0.1" : u.hostname === "127.0.0.1" ? "localhost" : null;
  return new Set([u.origin, ...(twin ? [`${u.protocol}//${twin}${u.port ? `:${u.port}` : ""}`] : [])]);
}
const OWN_ORIGINS = ownOrigins();

/**
 * Browsers send Origin with every cross-site POST/PUT/DELETE; one from another site is a
 * forged request (CSRF) and is refused before anything runs. Requests without Origin come
 * from non-browser clients, which cannot carry a victim's cookies for us.
 */
export function assertSameOrigin(request: Request): void {
  if (SAFE_METHODS.has(request.method)) return;
  const origin = request.headers.get("origin");
  const site = request.headers.get("sec-fetch-site");
  if ((origin && origin !== "null" && !OWN_ORIGINS.has(origin)) || origin === "null" || site === "cross-site") {
    throw new Forbidden("Requests from other sites are not accepted");
  }
}

export type ApiErrorBody = { error: { code: string; message: string; fieldErrors?: Record<string, string[]> } };

export function errorResponse(error: DomainError): NextResponse<ApiErrorBody> {
  return NextResponse.json(
    { error: { code: error.code, message: error.message, ...(error.fieldErrors ? { fieldErrors: error.fieldErrors } : {}) } },
    { status: error.status, headers: error instanceof TooManyRequests ? { "Retry-After": String(error.retryAfterSeconds) } : undefined },
  );
}

type Handler<C> = (request: Request, context: C) => Promise<Response>;

/** Wraps a route handler: domain errors become JSON replies, anything else is logged and a plain 500. */
export function withApi<C>(handler: Handler<C>): Handler<C> {
  return async (request, context) => {
    try {
      assertSameOrigin(request);
      return await handler(request, context);
    } catch (error) {
      if (error instanceof DomainError) return errorResponse(error);
      console.error("[api] unexpected error", request.method, new URL(request.url).pathname, error);
      return NextResponse.json({ error: { code: "internal", message: "Something went wrong on our side." } }, { status: 500 });
    }
  };
}

export function fieldErrorsOf(error: z.core.$ZodError): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_";
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

/** Parses with zod; takes zod/mini schemas too (the form schemas in lib/validations that browsers also load). */
export function parseWith<T extends z.core.$ZodType>(schema: T, input: unknown): z.output<T> {
  const parsed = z.safeParse(schema, input);
  if (!parsed.success) {
    const fieldErrors = fieldErrorsOf(parsed.error);
    const first = Object.entries(fieldErrors)[0];
    throw new Invalid(first ? `${first[0]}: ${first[1][0]}` : "Invalid input", fieldErrors);
  }
  return parsed.data;
}

/** Reads a JSON body; a body that is not JSON is the caller's mistake (400), not ours. */
export async function readJson(request: Request): Promise<unknown> {
  let text: string;
  try {
    text = await request.text();
  } catch {
    // The client hung up before its body arrived ("aborted", ECONNRESET): nothing ran and nobody waits for the
    // answer. A 400 rather than a 500 keeps a dropped connection out of the unexpected-error log (the load test saw
    // one for every request in flight when its clients stopped).
    throw new Invalid("The request body did not arrive in full", { _: ["The request body did not arrive in full"] });
  }
  // The body as a whole is the field at fault ("_", as fieldErrorsOf names an issue at the root).
  if (text.length > 200_000) throw new Invalid("Request body is too large", { _: ["Request body is too large (at most 200 000 characters)"] });
  try {
    return text ? JSON.parse(text) : {};
  } catch {
    throw new Invalid("Request body must be JSON", { _: ["Request body must be JSON"] });
  }
}
