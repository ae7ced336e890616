import { spawn, type ChildProcessWithoutNullStreams } from "node:child_process";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { useTempDatabase } from "../support/temp-db";

// lib/api/rate-limit.ts against a temporary SQLite file migrated from scratch: window boundaries at the exact
// millisecond, concurrent attempts inside one process, and attempts from several processes at once (as several
// app instances sharing one database would make them). The expected figures are plain counting: with a limit of
// `max`, exactly `max` attempts of a window go through and every attempt gets its own count.

/** Starts an instance (tests/integration/rate-limit-instance.ts) and resolves once it has loaded and waits for "go". */
function startInstance(args: string[], env: NodeJS.ProcessEnv): Promise<{ child: ChildProcessWithoutNullStreams; output: Promise<string> }> {
  const child = spawn(process.execPath, ["--conditions=react-server", "--import", "tsx", "tests/integration/rate-limit-instance.ts", ...args], { env });
  let stdout = "";
  const output = new Promise<string>((resolve, reject) => {
    child.on("exit", (code) => (code === 0 ? resolve(stdout) : reject(new Error(`instance exited with ${code}`))));
  });
  return new Promise((resolve, reject) => {
    child.stderr.on("data", (d: Buffer) => process.stderr.write(d));
    child.stdout.on("data", (d: Buffer) => {
      stdout += d.toString();
      if (stdout.startsWith("ready\n")) resolve({ child, output });
    });
    child.on("error", reject);
  });
}

let cleanup: () => void;
let url: string;
let limiter: typeof import("@/lib/api/rate-limit");
let errors: typeof import("@/lib/errors");

beforeAll(async () => {
  ({ url, cleanup } = await useTempDatabase());
  limiter = await import("@/lib/api/rate-limit");
  errors = await import("@/lib/errors");
});
afterAll(() => cleanup());

const T0 = Date.UTC(2026, 0, 5, 8, 0, 0);

describe("consumeRateLimit: one fixed window per rule and account", () => {
  const rule = { name: "test:window", max: 3, windowSeconds: 10, what: "test attempts" };

  it("lets `max` attempts through, refuses the next until the window's last millisecond, and opens a new one at its end", async () => {
    const at = (ms: number) => limiter.consumeRateLimit(rule, "account-a", { now: T0 + ms });
    expect(await at(0)).toMatchObject({ allowed: true, count: 1, windowStartedAt: T0 });
    expect(await at(1_000)).toMatchObject({ allowed: true, count: 2, windowStartedAt: T0 });
    expect(await at(2_500)).toMatchObject({ allowed: true, count: 3 });
    // The 4th inside [T0, T0 + 10 s): refused, and told how long is left, rounded up to whole seconds.
    expect(await at(2_501)).toMatchObject({ allowed: false, count: 4, retryAfterSeconds: 8 }); // 7.499 s left → 8
    expect(await at(9_001)).toMatchObject({ allowed: false, count: 5, retryAfterSeconds: 1 }); // 0.999 s left → 1
    expect(await at(9_999)).toMatchObject({ allowed: false, retryAfterSeconds: 1 });
    // T0 + 10 s is the first instant of the next window.
    expect(await at(10_000)).toMatchObject({ allowed: true, count: 1, windowStartedAt: T0 + 10_000, retryAfterSeconds: 10 });
    expect(await at(19_999)).toMatchObject({ allowed: true, count: 2, windowStartedAt: T0 + 10_000 });
  });

  it("keeps accounts and rules apart", async () => {
    for (let i = 0; i < 3; i++) await limiter.consumeRateLimit(rule, "account-b", { now: T0 });
    expect((await limiter.consumeRateLimit(rule, "account-b", { now: T0 })).allowed).toBe(false);
    expect((await limiter.consumeRateLimit(rule, "account-c", { now: T0 })).allowed).toBe(true);
    expect((await limiter.consumeRateLimit({ ...rule, name: "test:other" }, "account-b", { now: T0 })).allowed).toBe(true);
  });

  it("counts 200 concurrent attempts exactly: counts 1…200 once each, 50 allowed", async () => {
    const many = { name: "test:burst", max: 50, windowSeconds: 600, what: "test attempts" };
    const decisions = await Promise.all(Array.from({ length: 200 }, () => limiter.consumeRateLimit(many, "account-d", { now: T0 })));
    expect(decisions.map((d) => d.count).sort((a, b) => a - b)).toEqual(Array.from({ length: 200 }, (_, i) => i + 1));
    expect(decisions.filter((d) => d.allowed)).toHaveLength(50);
    expect(decisions.filter((d) => d.allowed).every((d) => d.count <= 50)).toBe(true);
  });

  it("counts exactly across processes: four instances × 40 attempts at once on one file, 60 allowed", async () => {
    const env = { ...process.env, DATABASE_URL: url };
    const instances = await Promise.all(Array.from({ length: 4 }, () => startInstance(["40", "60", String(T0)], env)));
    for (const { child } of instances) child.stdin.write("go\n");
    const outputs = await Promise.all(instances.map((i) => i.output));
    const decisions = outputs.flatMap((o) => JSON.parse(o.trim().split("\n").at(-1) ?? "[]") as { allowed: boolean; count: number }[]);
    expect(decisions).toHaveLength(160);
    expect(decisions.map((d) => d.count).sort((a, b) => a - b)).toEqual(Array.from({ length: 160 }, (_, i) => i + 1));
    expect(decisions.filter((d) => d.allowed)).toHaveLength(60);
  }, 90_000);
});

describe("enforceRateLimit", () => {
  it("throws a 429 that names the limit and says when to come back", async () => {
    const rule = limiter.RATE_LIMITS.reservationCreate;
    for (let i = 0; i < rule.max; i++) await limiter.enforceRateLimit(rule, "farmer-e");
    const refusal = await limiter.enforceRateLimit(rule, "farmer-e").then(
      () => null,
      (error: unknown) => error,
    );
    expect(refusal).toBeInstanceOf(errors.TooManyRequests);
    if (!(refusal instanceof errors.TooManyRequests)) return;
    expect(refusal.status).toBe(429); // RFC 6585 §4
    expect(refusal.retryAfterSeconds).toBeGreaterThan(590);
    expect(refusal.retryAfterSeconds).toBeLessThanOrEqual(600);
    expect(refusal.message).toBe("Too many new reservations from this account: at most 30 in 10 minutes. Try again in 10 minutes.");
  });
});
