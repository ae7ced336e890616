import autocannon from "autocannon";
import { randomUUID } from "node:crypto";
import type { Acknowledgement } from "../../lib/ops/invariants";
import { nearestRank } from "../../lib/ops/invariants";
import { PLACES } from "../../lib/places/gazetteer";
import type { Account, SeededBatch } from "./accounts";
import type { ReviewSubject } from "./review-subjects";

// The mixed load: every scenario is its own autocannon instance with its own connections (and, for writes, a
// bounded rate), all running at once against the same server for the same time, so the server sees the mix and
// each scenario gets its own figures. Loopback only, bounded in connections and time.
//
// To add a scenario (reviews, for one), add an entry to the list in `scenarios()`: a name, its connections, a
// rate if it writes, the refusals it may meet (statuses that are neither success nor failure), and `next()`,
// which plans each request and may read its answer.

export interface PlannedRequest {
  method: "GET" | "POST" | "PUT" | "PATCH" | "DELETE";
  path: string;
  headers?: Record<string, string>;
  body?: string;
  /** what the request was, when a scenario sends more than one kind (shown beside the scenario's name) */
  variant?: string;
  onAnswer?: (status: number, body: string) => void;
}

export interface Scenario {
  name: string;
  connections: number;
  /** requests per second over all its connections; none = as fast as the server answers */
  rate?: number;
  /** statuses that are an expected refusal under this load (counted apart, never as a success) */
  refusals: readonly number[];
  next(): PlannedRequest;
}

export interface LoadWorld {
  base: string;
  farmers: readonly Account[];
  providerIds: readonly string[];
  batches: readonly SeededBatch[];
  rand: () => number;
  /** every reservation or move the load saw succeed, for the check afterwards */
  acks: Map<string, Acknowledgement>;
  /** present when the server has the reviews API: released reservations to review, and whom to read reviews of */
  reviews?: { subjects: ReviewSubject[]; hatcheryIds: readonly string[]; builderIds: readonly string[] };
}

export interface Tally {
  name: string;
  connections: number;
  rate: number | null;
  durationS: number;
  requests: number;
  times: number[];
  statusClasses: Record<"2xx" | "3xx" | "4xx" | "5xx", number>;
  statuses: Map<number, number>;
  variants: Map<string, number>;
  refused: number;
  unexpected: number;
  socketErrors: number;
  timeouts: number;
}

const pick = <T>(items: readonly T[], rand: () => number): T => {
  const item = items[Math.floor(rand() * items.length)];
  if (item === undefined) throw new Error("nothing to pick from");
  return item;
};

/** The scenario list. Writes are spread over all signed-in farmers at a modest rate per account. */
export function scenarios(world: LoadWorld): Scenario[] {
  const { rand, base } = world;
  const origin = { origin: base };
  const json = { "content-type": "application/json" };
  const cursors: string[] = [];
  const cancellable: { id: string; farmer: Account }[] = [];

  const search: Scenario = {
    name: "nearby search",
    connections: 8,
    refusals: [429],
    next() {
      if (cursors.length > 0 && rand() < 0.2) {
        // The next page of an earlier search, with exactly its parameters.
        const path = cursors.splice(Math.floor(rand() * cursors.length), 1)[0] ?? "";
        return { method: "GET", path, variant: "next page" };
      }
      const place = pick(PLACES, rand);
      const q = new URLSearchParams({
        lat: (place.lat + (rand() - 0.5) * 0.6).toFixed(4),
        lng: (place.lng + (rand() - 0.5) * 0.6).toFixed(4),
        radiusKm: String(pick([5, 10, 25, 50, 100, 200, 500], rand)),
        kind: pick(["all", "all", "hatchery", "builder"], rand),
        sort: rand() < 0.7 ? "distance" : "trust",
        limit: String(pick([10, 20, 50], rand)),
      });
      const species = pick(["", "", "tilapia", "catfish", "tilapia,catfish"], rand);
      if (species) q.set("species", species);
      const tankType = pick(["", "", "tarpaulin", "concrete", "earthen", "tarpaulin,concrete"], rand);
      if (tankType) q.set("tankType", tankType);
      if (rand() < 0.3) q.set("verified", "true");
      if (rand() < 0.2) q.set("readyNow", "true");
      const path = `/api/v1/listings/nearby?${q.toString()}`;
      return {
        method: "GET",
        path,
        variant: "first page",
        onAnswer(status, body) {
          if (status !== 200 || cursors.length > 200) return;
          const next = (JSON.parse(body) as { nextCursor: string | null }).nextCursor;
          if (next) cursors.push(`${path}&cursor=${encodeURIComponent(next)}`);
        },
      };
    },
  };

  const providerApi: Scenario = {
    name: "provider + batch API",
    connections: 4,
    refusals: [429],
    next() {
      if (rand() < 0.5) return { method: "GET", path: `/api/v1/providers/${pick(world.providerIds, rand)}`, variant: "provider" };
      return { method: "GET", path: `/api/v1/batches/${pick(world.batches, rand).id}`, variant: "batch" };
    },
  };

  const providerPage: Scenario = {
    name: "provider page (HTML)",
    connections: 2,
    refusals: [429],
    next: () => ({ method: "GET", path: `/providers/${pick(world.providerIds, rand)}` }),
  };

  const reserve: Scenario = {
    name: "reservation create",
    connections: 3,
    // 2/s over the 20 farmers is 6 a minute each, well under the per-account limit (lib/api/rate-limit.ts).
    rate: 2,
    // 409: no stock left (on purpose for the oversized requests); 429: a limit on reservations per account.
    refusals: [409, 429],
    next() {
      const farmer = pick(world.farmers, rand);
      const b = pick(world.batches, rand);
      // One in twenty asks for more than any batch holds, to load the refusal path (409 not_enough_stock).
      const count = rand() < 0.05 ? 1_000_000 : 1 + Math.floor(rand() * 25);
      const key = `load-${randomUUID()}`;
      return {
        method: "POST",
        path: "/api/v1/reservations",
        headers: { ...origin, ...json, cookie: farmer.cookie, "idempotency-key": key },
        body: JSON.stringify({ batchId: b.id, count, handoverMethod: b.handoverMethod }),
        variant: count === 1_000_000 ? "more than the batch" : "reserve",
        onAnswer(status, body) {
          if (status !== 201) return;
          const id = (JSON.parse(body) as { reservation: { id: string } }).reservation.id;
          world.acks.set(id, { reservationId: id, farmerId: farmer.id, batchId: b.id, count, step: "created", inDoubt: null });
          cancellable.push({ id, farmer });
        },
      };
    },
  };

  const cancel: Scenario = {
    name: "reservation cancel",
    connections: 1,
    rate: 1,
    refusals: [409, 429],
    next() {
      const target = cancellable.length > 0 ? cancellable.splice(Math.floor(rand() * cancellable.length), 1)[0] : undefined;
      if (!target) {
        // Nothing created yet to cancel: read a farmer's list instead, so the connection keeps its pace.
        return { method: "GET", path: "/api/v1/reservations?as=farmer&page=1&pageSize=20", headers: { cookie: pick(world.farmers, rand).cookie }, variant: "nothing to cancel: list" };
      }
      const ack = world.acks.get(target.id);
      if (ack) ack.inDoubt = "cancelled";
      return {
        method: "POST",
        path: `/api/v1/reservations/${target.id}/actions`,
        headers: { ...origin, ...json, cookie: target.farmer.cookie },
        body: JSON.stringify({ action: "cancel" }),
        variant: "cancel",
        onAnswer(status) {
          if (!ack) return;
          if (status === 200) ack.step = "cancelled";
          ack.inDoubt = null;
        },
      };
    },
  };

  const myReservations: Scenario = {
    name: "farmer's reservations",
    connections: 1,
    rate: 2,
    refusals: [429],
    next: () => ({ method: "GET", path: `/api/v1/reservations?as=farmer&page=1&pageSize=${pick([10, 20, 50], rand)}`, headers: { cookie: pick(world.farmers, rand).cookie } }),
  };

  return [search, providerApi, providerPage, reserve, cancel, myReservations, ...(world.reviews ? reviewScenarios(world, world.reviews) : [])];
}

/** Review reads (public, some signed in) and writes: new reviews of released reservations, then edits and helpful marks. */
function reviewScenarios(world: LoadWorld, reviews: NonNullable<LoadWorld["reviews"]>): Scenario[] {
  const { rand, base } = world;
  const headers = (cookie: string) => ({ origin: base, "content-type": "application/json", cookie });
  const subjects = [...reviews.subjects];
  const written: { id: string; author: Account }[] = [];
  const text = () => pick(["Healthy fingerlings, counted out in front of me.", "All fish alive after the first week in the hapa.", "Collected on time; a few smaller than promised."], rand);

  const read: Scenario = {
    name: "provider reviews (read)",
    connections: 2,
    refusals: [429],
    next() {
      const hatchery = reviews.builderIds.length === 0 || (reviews.hatcheryIds.length > 0 && rand() < 0.6);
      const q = new URLSearchParams({ role: hatchery ? "hatchery" : "builder", sort: rand() < 0.7 ? "newest" : "helpful", limit: String(pick([5, 10, 20], rand)) });
      if (rand() < 0.2) q.set("stars", String(1 + Math.floor(rand() * 5)));
      const id = pick(hatchery ? reviews.hatcheryIds : reviews.builderIds, rand);
      // A third of the readers are signed in (the reply then carries their own marks).
      return { method: "GET", path: `/api/v1/providers/${id}/reviews?${q.toString()}`, ...(rand() < 0.33 ? { headers: { cookie: pick(world.farmers, rand).cookie } } : {}) };
    },
  };

  const write: Scenario = {
    name: "review write",
    connections: 1,
    rate: 1,
    // 409: already reviewed or the edit window closed; 403: a helpful mark on a review the account may not mark; 429: a limit.
    refusals: [409, 429],
    next() {
      const subject = subjects.shift();
      if (subject) {
        return {
          method: "POST",
          path: "/api/v1/reviews",
          headers: headers(subject.farmer.cookie),
          body: JSON.stringify({ subjectKind: "reservation", subjectId: subject.reservationId, stars: 1 + Math.floor(rand() * 5), aspects: { fish_health: 4, count_as_promised: 5, size_as_promised: 3 }, body: text() }),
          variant: "new review",
          onAnswer(status, body) {
            if (status === 201) written.push({ id: (JSON.parse(body) as { review: { id: string } }).review.id, author: subject.farmer });
          },
        };
      }
      const target = written.length > 0 ? pick(written, rand) : undefined;
      if (!target) return { method: "GET", path: "/api/v1/me", headers: { cookie: pick(world.farmers, rand).cookie }, variant: "nothing to review yet: me" };
      if (rand() < 0.5) {
        return { method: "PATCH", path: `/api/v1/reviews/${target.id}`, headers: headers(target.author.cookie), body: JSON.stringify({ stars: 1 + Math.floor(rand() * 5), body: text() }), variant: "edit" };
      }
      const voter = world.farmers.find((f) => f.id !== target.author.id && rand() < 0.3) ?? world.farmers.find((f) => f.id !== target.author.id);
      if (!voter) return { method: "GET", path: "/api/v1/me", headers: { cookie: target.author.cookie }, variant: "nothing to review yet: me" };
      return { method: rand() < 0.7 ? "PUT" : "DELETE", path: `/api/v1/reviews/${target.id}/helpful`, headers: headers(voter.cookie), variant: "helpful mark" };
    },
  };
  return [read, write];
}

function emptyTally(s: Scenario, durationS: number): Tally {
  return {
    name: s.name,
    connections: s.connections,
    rate: s.rate ?? null,
    durationS,
    requests: 0,
    times: [],
    statusClasses: { "2xx": 0, "3xx": 0, "4xx": 0, "5xx": 0 },
    statuses: new Map(),
    variants: new Map(),
    refused: 0,
    unexpected: 0,
    socketErrors: 0,
    timeouts: 0,
  };
}

type Ctx = { plan?: PlannedRequest };

function runScenario(base: string, s: Scenario, seconds: number): Promise<Tally> {
  const tally = emptyTally(s, seconds);
  return new Promise<Tally>((resolve, reject) => {
    const instance = autocannon(
      {
        url: base,
        connections: s.connections,
        ...(s.rate ? { overallRate: s.rate } : {}),
        duration: seconds,
        // A request that takes longer than this on loopback counts as a failure (a socket error).
        timeout: 30,
        requests: [
          {
            setupRequest: (req, context) => {
              const plan = s.next();
              (context as Ctx).plan = plan;
              return { ...req, method: plan.method, path: plan.path, headers: { ...req.headers, ...plan.headers }, body: plan.body ?? "" };
            },
            onResponse: (status, body, context) => {
              const plan = (context as Ctx).plan;
              tally.requests += 1;
              tally.statuses.set(status, (tally.statuses.get(status) ?? 0) + 1);
              const cls = `${Math.floor(status / 100)}xx`;
              if (cls === "2xx" || cls === "3xx" || cls === "4xx" || cls === "5xx") tally.statusClasses[cls] += 1;
              if (plan?.variant) tally.variants.set(plan.variant, (tally.variants.get(plan.variant) ?? 0) + 1);
              // 5xx is counted by its class; `unexpected` is every other answer that is neither success nor refusal.
              if (s.refusals.includes(status)) tally.refused += 1;
              else if ((status < 200 || status >= 300) && status < 500) tally.unexpected += 1;
              try {
                plan?.onAnswer?.(status, body);
              } catch (err) {
                tally.unexpected += 1;
                console.error(`[load] ${s.name}: could not read the answer to ${plan?.method} ${plan?.path}:`, err instanceof Error ? err.message : err);
              }
            },
          },
        ],
      },
      (error, result) => {
        if (error) {
          reject(error);
          return;
        }
        tally.socketErrors = result.errors;
        tally.timeouts = result.timeouts;
        tally.durationS = result.duration;
        resolve(tally);
      },
    );
    instance.on("response", (_client, _status, _bytes, responseTime) => tally.times.push(responseTime));
  });
}

/** Runs every scenario at once for `seconds`; returns one tally per scenario. */
export async function runMixedLoad(world: LoadWorld, seconds: number): Promise<Tally[]> {
  return Promise.all(scenarios(world).map((s) => runScenario(world.base, s, seconds)));
}

const ms = (v: number) => (Number.isFinite(v) ? v.toFixed(1) : "–");

/** The figures table; returns the failures (5xx, unexpected answers, socket errors) as lines. */
export function reportMixedLoad(tallies: readonly Tally[], seconds: number): { failures: string[]; summary: string } {
  const failures: string[] = [];
  const all = tallies.flatMap((t) => t.times).sort((a, b) => a - b);
  console.log(`\nMixed load: ${tallies.length} scenarios at once for ${seconds} s, ${tallies.reduce((s, t) => s + t.connections, 0)} connections in all (loopback)`);
  console.log("scenario                  conns  rate/s  requests   req/s  p50 ms  p95 ms  p99 ms   2xx   3xx   4xx   5xx  refused  unexpected  socket errors  error rate");
  for (const t of tallies) {
    const sorted = [...t.times].sort((a, b) => a - b);
    const failed = t.statusClasses["5xx"] + t.unexpected + t.socketErrors;
    const attempts = t.requests + t.socketErrors;
    const rate = attempts > 0 ? (100 * failed) / attempts : 0;
    console.log(
      `${t.name.padEnd(24)}  ${String(t.connections).padStart(5)}  ${(t.rate === null ? "max" : String(t.rate)).padStart(6)}  ${String(t.requests).padStart(8)}  ${(t.requests / t.durationS).toFixed(1).padStart(6)}  ${ms(nearestRank(sorted, 50)).padStart(6)}  ${ms(nearestRank(sorted, 95)).padStart(6)}  ${ms(nearestRank(sorted, 99)).padStart(6)}  ${String(t.statusClasses["2xx"]).padStart(4)}  ${String(t.statusClasses["3xx"]).padStart(4)}  ${String(t.statusClasses["4xx"]).padStart(4)}  ${String(t.statusClasses["5xx"]).padStart(4)}  ${String(t.refused).padStart(7)}  ${String(t.unexpected).padStart(10)}  ${String(t.socketErrors).padStart(13)}  ${rate.toFixed(2).padStart(9)} %`,
    );
    const statuses = [...t.statuses.entries()].sort((a, b) => a[0] - b[0]).map(([s, n]) => `${s}×${n}`).join(" ");
    const variants = [...t.variants.entries()].map(([v, n]) => `${v} ${n}`).join(", ");
    console.log(`${"".padEnd(26)}statuses ${statuses}${variants ? ` · ${variants}` : ""}`);
    if (t.statusClasses["5xx"] > 0) failures.push(`${t.name}: ${t.statusClasses["5xx"]} answers of 5xx`);
    if (t.unexpected > 0) failures.push(`${t.name}: ${t.unexpected} unexpected answers (${statuses})`);
    if (t.socketErrors > 0) failures.push(`${t.name}: ${t.socketErrors} socket errors (${t.timeouts} timeouts)`);
  }
  const requests = tallies.reduce((s, t) => s + t.requests, 0);
  const duration = Math.max(...tallies.map((t) => t.durationS));
  const fivexx = tallies.reduce((s, t) => s + t.statusClasses["5xx"], 0);
  const socket = tallies.reduce((s, t) => s + t.socketErrors, 0);
  const refused = tallies.reduce((s, t) => s + t.refused, 0);
  const summary = `${requests} requests in ${duration.toFixed(0)} s = ${(requests / duration).toFixed(1)} req/s, p50 ${ms(nearestRank(all, 50))} ms, p95 ${ms(nearestRank(all, 95))} ms, p99 ${ms(nearestRank(all, 99))} ms; ${fivexx} × 5xx, ${socket} socket errors, ${refused} expected refusals (409/429)`;
  console.log(`all                       ${summary}`);
  return { failures, summary };
}
