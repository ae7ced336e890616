import "server-only";
import { NextResponse } from "next/server";
import { z } from "zod";
import { DomainError, Invalid } from "@/lib/errors";

export type ApiErrorBody = { error: { code: string; message: string; fieldErrors?: Record<string, string[]> } };

export function errorResponse(error: DomainError): NextResponse<ApiErrorBody> {
  return NextResponse.json(
    { error: { code: error.code, message: error.message, ...(error.fieldErrors ? { fieldErrors: error.fieldErrors } : {}) } },
    { status: error.status },
  );
}

type Handler<C> = (request: Request, context: C) => Promise<Response>;

/** Wraps a route handler: domain errors become JSON replies, anything else is logged and a plain 500. */
export function withApi<C>(handler: Handler<C>): Handler<C> {
  return async (request, context) => {
    try {
      return await handler(request, context);
    } catch (error) {
      if (error instanceof DomainError) return errorResponse(error);
      console.error("[api] unexpected error", request.method, new URL(request.url).pathname, error);
      return NextResponse.json({ error: { code: "internal", message: "Something went wrong on our side." } }, { status: 500 });
    }
  };
}

export function fieldErrorsOf(error: z.ZodError): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join(".") : "_";
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

export function parseWith<T extends z.ZodType>(schema: T, input: unknown): z.infer<T> {
  const parsed = schema.safeParse(input);
  if (!parsed.success) {
    const fieldErrors = fieldErrorsOf(parsed.error);
    const first = Object.entries(fieldErrors)[0];
    throw new Invalid(first ? `${first[0]}: ${first[1][0]}` : "Invalid input", fieldErrors);
  }
  return parsed.data;
}

/** Reads a JSON body; a body that is not JSON is the caller's mistake (400), not ours. */
export async function readJson(request: Request): Promise<unknown> {
  const text = await request.text();
  if (text.length > 200_000) throw new Invalid("Request body is too large");
  try {
    return text ? JSON.parse(text) : {};
  } catch {
    throw new Invalid("Request body must be JSON");
  }
}
