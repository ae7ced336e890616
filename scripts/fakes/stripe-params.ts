// Reading typed parameters out of a decoded Stripe form body, with Stripe-style 400 errors.
import type { FormObject, FormValue } from "./stripe-form";

export interface StripeErrorBody {
  type: "invalid_request_error" | "card_error" | "idempotency_error" | "api_error";
  message: string;
  code?: string;
  decline_code?: string;
  param?: string;
  doc_url?: string;
  charge?: string;
  payment_intent?: unknown;
}

export class StripeApiError extends Error {
  constructor(
    readonly status: number,
    readonly body: StripeErrorBody,
    /**
     * Stripe keeps an idempotent result only once the endpoint began executing; a request refused while
     * its parameters were being validated is not remembered (docs.stripe.com/api/idempotent_requests).
     */
    readonly beforeExecution = false,
  ) {
    super(body.message);
    this.name = "StripeApiError";
  }
}

export function invalidParam(message: string, param: string, code?: string): StripeApiError {
  return new StripeApiError(400, { type: "invalid_request_error", message, param, ...(code ? { code } : {}) }, true);
}

/** Refuses parameters an endpoint does not know, as Stripe does (`parameter_unknown`). */
export function rejectUnknown(params: FormObject, allowed: readonly string[]): void {
  for (const key of Object.keys(params)) {
    if (!allowed.includes(key)) {
      throw invalidParam(`Received unknown parameter: ${key}`, key, "parameter_unknown");
    }
  }
}

export function optionalString(params: FormObject, name: string): string | undefined {
  const value = params[name];
  if (value === undefined) return undefined;
  if (typeof value !== "string") throw invalidParam(`Invalid string: ${name} must be a string`, name, "parameter_invalid_string");
  return value;
}

export function requiredString(params: FormObject, name: string): string {
  const value = optionalString(params, name);
  if (value === undefined || value === "") throw invalidParam(`Missing required param: ${name}.`, name, "parameter_missing");
  return value;
}

export function optionalInteger(params: FormObject, name: string): number | undefined {
  const value = params[name];
  if (value === undefined) return undefined;
  if (typeof value !== "string" || !/^-?\d+$/.test(value)) {
    throw invalidParam(`Invalid integer: ${typeof value === "string" ? value : name}`, name, "parameter_invalid_integer");
  }
  const parsed = Number(value);
  if (!Number.isSafeInteger(parsed)) throw invalidParam(`Invalid integer: ${value}`, name, "parameter_invalid_integer");
  return parsed;
}

export function requiredInteger(params: FormObject, name: string): number {
  const value = optionalInteger(params, name);
  if (value === undefined) throw invalidParam(`Missing required param: ${name}.`, name, "parameter_missing");
  return value;
}

export function optionalBoolean(params: FormObject, name: string): boolean | undefined {
  const value = params[name];
  if (value === undefined) return undefined;
  if (value === "true") return true;
  if (value === "false") return false;
  throw invalidParam(`Invalid boolean: ${typeof value === "string" ? value : name}`, name, "parameter_invalid_boolean");
}

export function optionalEnum<T extends string>(params: FormObject, name: string, allowed: readonly T[]): T | undefined {
  const value = optionalString(params, name);
  if (value === undefined) return undefined;
  if (!(allowed as readonly string[]).includes(value)) {
    throw invalidParam(`Invalid ${name}: must be one of ${allowed.join(", ")}`, name);
  }
  return value as T;
}

export function stringList(params: FormObject, name: string): string[] {
  const value: FormValue | undefined = params[name];
  if (value === undefined) return [];
  if (!Array.isArray(value) || value.some((item) => typeof item !== "string")) {
    throw invalidParam(`Invalid array: ${name}`, name, "parameter_invalid_array");
  }
  return value as string[];
}

// Stripe's documented metadata limits: 50 keys, key names up to 40 characters, values up to 500.
const METADATA_MAX_KEYS = 50;
const METADATA_KEY_MAX = 40;
const METADATA_VALUE_MAX = 500;

/**
 * Applies a `metadata` parameter to existing metadata the way Stripe does: keys are merged, a key set to
 * the empty string is removed, and `metadata=` (empty) clears everything.
 */
export function mergeMetadata(existing: Record<string, string>, params: FormObject): Record<string, string> {
  const value = params.metadata;
  if (value === undefined) return existing;
  if (value === "") return {};
  if (typeof value !== "object" || Array.isArray(value)) {
    throw invalidParam("Invalid metadata: must be an object with string values", "metadata");
  }
  const merged: Record<string, string> = { ...existing };
  for (const [key, entry] of Object.entries(value)) {
    if (typeof entry !== "string") throw invalidParam(`Invalid metadata[${key}]: must be a string`, `metadata[${key}]`);
    if (key.length > METADATA_KEY_MAX) {
      throw invalidParam(`Metadata keys can be at most ${METADATA_KEY_MAX} characters long.`, `metadata[${key}]`);
    }
    if (entry.length > METADATA_VALUE_MAX) {
      throw invalidParam(`Metadata values can be at most ${METADATA_VALUE_MAX} characters long.`, `metadata[${key}]`);
    }
    if (entry === "") delete merged[key];
    else merged[key] = entry;
  }
  if (Object.keys(merged).length > METADATA_MAX_KEYS) {
    throw invalidParam(`You can have at most ${METADATA_MAX_KEYS} metadata keys.`, "metadata");
  }
  return merged;
}
