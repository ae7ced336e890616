// The mail stand-in is checked through the official `resend` SDK (6.38.0): if the SDK can send,
// read and list through it, and sees the documented error shapes, the app can too.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { Resend } from "resend";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { z } from "zod";
import { startMailServer, type RunningMailServer } from "./mail-server";

const API_KEY = "re_test_shoal";
let dataDir: string;
let server: RunningMailServer;
let resend: Resend;

beforeAll(async () => {
  dataDir = mkdtempSync(join(tmpdir(), "mail-fake-"));
  server = await startMailServer({ port: 0, dataDir, apiKey: API_KEY });
  // The SDK takes `baseUrl` in its constructor options (node_modules/resend/dist/index.mjs, `options?.baseUrl`).
  resend = new Resend(API_KEY, { baseUrl: server.url });
});

afterAll(async () => {
  await server.close();
  rmSync(dataDir, { recursive: true, force: true });
});

afterEach(async () => {
  const res = await fetch(`${server.url}/emails`, { method: "DELETE", headers: { Authorization: `Bearer ${API_KEY}` } });
  expect(res.status).toBe(200);
});

const message = {
  from: "Shoal <no-reply@shoal.test>",
  to: "farmer@example.org",
  subject: "Your reservation of 150 tilapia fingerlings",
  html: "<p>The hatchery accepted your reservation.</p>",
  text: "The hatchery accepted your reservation.",
  tags: [{ name: "kind", value: "reservation_accepted" }],
};

describe("mail stand-in through the resend SDK", () => {
  it("sends, then retrieves the same message in Resend's retrieve shape", async () => {
    const sent = await resend.emails.send(message);
    expect(sent.error).toBeNull();
    const id = sent.data?.id ?? "";
    // Resend ids are UUIDs; zod's uuid() follows RFC 9562.
    expect(z.uuid().safeParse(id).success).toBe(true);

    const got = await resend.emails.get(id);
    expect(got.error).toBeNull();
    expect(got.data).toMatchObject({
      object: "email",
      id,
      from: message.from,
      to: [message.to], // the API normalises a single recipient to a list (Resend API reference, retrieve email)
      subject: message.subject,
      html: message.html,
      text: message.text,
      tags: message.tags,
    });
    // created_at must be an ISO 8601 instant that round-trips through Date (ECMA-262 Date Time String Format).
    const createdAt = got.data?.created_at ?? "";
    expect(new Date(createdAt).toISOString()).toBe(createdAt);
  });

  it("lists the outbox newest first, through the SDK's list call and the raw endpoint", async () => {
    const ids: string[] = [];
    for (const subject of ["first", "second", "third"]) {
      const sent = await resend.emails.send({ ...message, subject });
      ids.push(sent.data?.id ?? "");
    }
    const listed = await resend.emails.list();
    expect(listed.error).toBeNull();
    expect(listed.data?.data.map((email) => email.id)).toEqual([...ids].reverse());

    const raw = await fetch(`${server.url}/emails`, { headers: { Authorization: `Bearer ${API_KEY}` } });
    const body = (await raw.json()) as { data: { subject: string; html: string; text: string }[] };
    expect(body.data.map((email) => email.subject)).toEqual(["third", "second", "first"]);
    expect(body.data[0]).toMatchObject({ html: message.html, text: message.text });

    const limited = await resend.emails.list({ limit: 2 });
    expect(limited.data?.data).toHaveLength(2);
    expect(limited.data?.has_more).toBe(true);
  });

  it("honours Idempotency-Key: the same key gives the same id and stores one message", async () => {
    // The SDK sends `Idempotency-Key` when given `idempotencyKey` (index.mjs, Resend#post).
    const first = await resend.emails.send(message, { idempotencyKey: "reservation-42/accepted" });
    const second = await resend.emails.send(message, { idempotencyKey: "reservation-42/accepted" });
    expect(first.error).toBeNull();
    expect(second.data?.id).toBe(first.data?.id);

    const listed = await resend.emails.list();
    expect(listed.data?.data).toHaveLength(1);

    // Resend API reference (idempotency keys): a reused key with a different payload is a 409.
    const changed = await resend.emails.send(
      { ...message, subject: "another subject" },
      { idempotencyKey: "reservation-42/accepted" },
    );
    expect(changed.data).toBeNull();
    expect(changed.error).toMatchObject({ name: "invalid_idempotent_request", statusCode: 409 });

    const other = await resend.emails.send(message, { idempotencyKey: "reservation-43/accepted" });
    expect(other.data?.id).not.toBe(first.data?.id);
  });

  it("answers a request without a Bearer key with 401 in Resend's error shape", async () => {
    // The SDK always sends its key, so this path is checked with a bare request.
    const res = await fetch(`${server.url}/emails`, {
      method: "POST",
      headers: { "Content-Type": "application/json" },
      body: JSON.stringify(message),
    });
    expect(res.status).toBe(401);
    // Error shape { name, message, statusCode } is the SDK's ErrorResponse type (index.d.mts).
    expect(await res.json()).toMatchObject({ name: "missing_api_key", statusCode: 401, message: expect.any(String) });

    const wrongKey = new Resend("re_someone_else", { baseUrl: server.url });
    const refused = await wrongKey.emails.send(message);
    expect(refused.error).toMatchObject({ name: "invalid_api_key", statusCode: 403 });
    expect((await resend.emails.list()).data?.data).toHaveLength(0);
  });

  it("refuses missing or malformed fields with 422 and stores nothing", async () => {
    const noSubject = await resend.emails.send({ ...message, subject: "" });
    expect(noSubject.error).toMatchObject({ name: "missing_required_field", statusCode: 422 });
    expect(noSubject.error?.message).toContain("subject");

    const badTo = await resend.emails.send({ ...message, to: "not-an-address" });
    expect(badTo.error).toMatchObject({ name: "validation_error", statusCode: 422 });

    // An empty text and no html leaves nothing to deliver.
    const noBody = await resend.emails.send({ from: message.from, to: message.to, subject: "x", text: "" });
    expect(noBody.error).toMatchObject({ name: "missing_required_field", statusCode: 422 });

    expect((await resend.emails.list()).data?.data).toHaveLength(0);
  });

  it("answers an unknown id with 404 not_found", async () => {
    const got = await resend.emails.get("00000000-0000-4000-8000-000000000000");
    expect(got.error).toMatchObject({ name: "not_found", statusCode: 404 });
  });

  it("keeps messages across a restart on the same data folder", async () => {
    const sent = await resend.emails.send(message);
    await server.close();
    server = await startMailServer({ port: 0, dataDir, apiKey: API_KEY });
    resend = new Resend(API_KEY, { baseUrl: server.url });
    const got = await resend.emails.get(sent.data?.id ?? "");
    expect(got.data?.subject).toBe(message.subject);
    // A restarted server must still order new mail after old.
    const later = await resend.emails.send({ ...message, subject: "after restart" });
    const listed = await resend.emails.list();
    expect(listed.data?.data.map((email) => email.id)).toEqual([later.data?.id, sent.data?.id]);
  });
});
