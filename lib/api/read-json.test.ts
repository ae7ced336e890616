import { afterEach, describe, expect, it, vi } from "vitest";

// A client that hangs up while sending its body (the load test's clients do, when they stop mid-request) is a
// client error: RFC 9110 §15.5.1 gives 400 for a request the server cannot process because of the client, and
// keeps 500 (§15.6.1) for an unexpected condition on the server (from memory).

process.env.BETTER_AUTH_SECRET ??= "read-json-test-secret-of-32-characters!";

/** A POST whose body stream breaks after its first bytes, as Node's request stream does on ECONNRESET. */
function cutOffRequest(): Request {
  const body = new ReadableStream<Uint8Array>({
    start(controller) {
      controller.enqueue(new TextEncoder().encode('{"batchId":"b1","cou'));
      controller.error(Object.assign(new Error("aborted"), { code: "ECONNRESET" }));
    },
  });
  return new Request("http://127.0.0.1:3000/api/v1/reservations", { method: "POST", body, duplex: "half" } as RequestInit);
}

afterEach(() => {
  vi.restoreAllMocks();
});

describe("readJson", () => {
  it("refuses a body cut off by the client with 400", async () => {
    const { readJson } = await import("./handler");
    const { DomainError } = await import("@/lib/errors");
    const error = await readJson(cutOffRequest()).then(
      () => null,
      (e: unknown) => e,
    );
    expect(error).toBeInstanceOf(DomainError);
    // Said as a body that did not arrive, not as a complete body that is not JSON.
    expect(error instanceof DomainError ? [error.status, error.code, error.message] : null).toEqual([400, "invalid", "The request body did not arrive in full"]);
  });

  it("keeps a cut-off body out of the unexpected-error log", async () => {
    const { readJson, withApi } = await import("./handler");
    const logged = vi.spyOn(console, "error").mockImplementation(() => undefined);
    const handler = withApi(async (request: Request) => Response.json(await readJson(request)));
    const response = await handler(cutOffRequest(), {});
    expect(response.status).toBe(400);
    expect(logged).not.toHaveBeenCalled();
    // A whole body still reads as before.
    const whole = await handler(new Request("http://127.0.0.1:3000/api/v1/reservations", { method: "POST", body: '{"count":3}' }), {});
    expect(await whole.json()).toEqual({ count: 3 });
  });
});
