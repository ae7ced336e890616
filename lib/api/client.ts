/** The one fetch helper of the browser side: JSON in, a result value out, never a throw for expected failures. */
export type ApiResult<T> =
  | { ok: true; data: T }
  | { ok: false; status: number; message: string; fieldErrors?: Record<string, string[]> };

export type SendOptions = {
  /** for calls that take stock or move money: the same key when the same request is retried (lib/api/idempotency.ts) */
  idempotencyKey?: string;
};

async function send<T>(method: string, url: string, body?: unknown, options: SendOptions = {}): Promise<ApiResult<T>> {
  let response: Response;
  try {
    const headers: Record<string, string> = {};
    if (body !== undefined) headers["content-type"] = "application/json";
    if (options.idempotencyKey) headers["idempotency-key"] = options.idempotencyKey;
    response = await fetch(url, {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch {
    return { ok: false, status: 0, message: "You seem to be offline. Nothing was lost: check your connection and try again." };
  }
  const json: unknown = await response.json().catch(() => null);
  if (response.ok) return { ok: true, data: json as T };
  const err = (json as { error?: { message?: string; fieldErrors?: Record<string, string[]> } } | null)?.error;
  return {
    ok: false,
    status: response.status,
    message: err?.message ?? (response.status >= 500 ? `Shoal could not finish this just now (error ${response.status}). Nothing you typed was lost: try again in a moment.` : `The server answered ${response.status}. Try again.`),
    fieldErrors: err?.fieldErrors,
  };
}

export const getJson = <T,>(url: string) => send<T>("GET", url);
export const postJson = <T = unknown,>(url: string, body: unknown, options?: SendOptions) => send<T>("POST", url, body, options);
export const putJson = <T = unknown,>(url: string, body: unknown) => send<T>("PUT", url, body);
export const patchJson = <T = unknown,>(url: string, body: unknown) => send<T>("PATCH", url, body);
export const deleteJson = <T = unknown,>(url: string) => send<T>("DELETE", url);
