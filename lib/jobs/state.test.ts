import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { holdTransition, newHold, type DepositHold } from "@/lib/payments/hold-state";
import { assertBalanced, balances, entriesFor, type LedgerEntry } from "@/lib/payments/ledger";
import { JOB_ACTORS, JOB_EVENTS, JOB_STATES, jobTransition, newJob, type Job, type JobActor, type JobActorRole, type JobEvent, type JobState } from "./state";

// The oracle is the brief for this machine (scheduled → on_site → built → completed | disputed → resolved; cancelled;
// builder, farmer, admin, and the system confirming after 7 days), written out by hand below; none of it is read
// from JOB_RULES. Dates are worked by hand from the 7-day auto-confirm window.

const FARMER = "farmer-1";
const BUILDER = "builder-1";
const DEPOSIT = 70_745; // 30 % of ZMW 2 358.15, the quote worked in quote.test.ts
const BUILT_AT = new Date("2025-04-10T16:00:00.000Z");

const ACTORS: Record<JobActorRole, JobActor> = {
  farmer: { role: "farmer", userId: FARMER },
  builder: { role: "builder", userId: BUILDER },
  admin: { role: "admin", userId: "admin-1" },
  system: { role: "system" },
};

function jobIn(state: JobState): Job {
  const scheduled = newJob({ farmerId: FARMER, builderId: BUILDER, currency: "ZMW", depositMinor: DEPOSIT });
  const onSite = { ...scheduled, onSiteAt: new Date("2025-04-08T07:00:00.000Z") };
  const built = { ...onSite, builtAt: BUILT_AT, completionPhotoCount: 4 };
  switch (state) {
    case "scheduled":
    case "cancelled":
      return { ...scheduled, state };
    case "on_site":
      return { ...onSite, state };
    default:
      return { ...built, state };
  }
}

const SAMPLES: Record<string, JobEvent> = {
  arrive: { type: "arrive" },
  mark_built: { type: "mark_built", photoCount: 4 },
  confirm: { type: "confirm" },
  auto_confirm: { type: "auto_confirm" },
  dispute: { type: "dispute" },
  "resolve for farmer": { type: "resolve", outcome: "for_farmer" },
  "resolve for builder": { type: "resolve", outcome: "for_builder" },
  "resolve split": { type: "resolve", outcome: "split", releaseMinor: 40_000 },
  cancel: { type: "cancel" },
};

function nowFor(sample: string): Date {
  // Built 10 Apr 16:00; it confirms itself from 17 Apr 16:00.
  return sample === "auto_confirm" ? new Date("2025-04-20T16:00:00.000Z") : new Date("2025-04-12T16:00:00.000Z");
}

const mail = (template: string, to: "farmer" | "builder" | "admins") => ({ kind: "mail", template, to });
const both = (template: string) => [mail(template, "farmer"), mail(template, "builder")];
const disputed = [{ kind: "hold", event: { type: "freeze" }, actor: "farmer" }, mail("job-disputed", "builder"), mail("job-disputed", "admins")];

const LEGAL: Array<[JobState, string, JobActorRole, JobState, unknown[]]> = [
  ["scheduled", "arrive", "builder", "on_site", [mail("job-started", "farmer")]],
  ["scheduled", "cancel", "farmer", "cancelled", [{ kind: "hold", event: { type: "refund" }, actor: "farmer" }, mail("job-cancelled", "builder")]],
  ["scheduled", "cancel", "builder", "cancelled", [{ kind: "hold", event: { type: "refund" }, actor: "provider" }, mail("job-cancelled", "farmer")]],
  // Marked built on 12 Apr 16:00, so it confirms itself from 19 Apr 16:00.
  ["on_site", "mark_built", "builder", "built", [mail("job-built", "farmer"), { kind: "schedule", event: "auto_confirm", at: new Date("2025-04-19T16:00:00.000Z") }]],
  ["on_site", "dispute", "farmer", "disputed", disputed],
  ["built", "confirm", "farmer", "completed", [{ kind: "hold", event: { type: "release", amountMinor: DEPOSIT }, actor: "farmer" }, ...both("job-completed")]],
  ["built", "auto_confirm", "system", "completed", [{ kind: "hold", event: { type: "release", amountMinor: DEPOSIT }, actor: "system" }, ...both("job-completed")]],
  ["built", "dispute", "farmer", "disputed", disputed],
  ["disputed", "resolve for farmer", "admin", "resolved", [{ kind: "hold", event: { type: "resolve", outcome: "for_farmer" }, actor: "admin" }, ...both("job-dispute-resolved")]],
  [
    "disputed",
    "resolve for builder",
    "admin",
    "resolved",
    [{ kind: "hold", event: { type: "resolve", outcome: "for_provider", amountMinor: DEPOSIT }, actor: "admin" }, ...both("job-dispute-resolved")],
  ],
  [
    "disputed",
    "resolve split",
    "admin",
    "resolved",
    [{ kind: "hold", event: { type: "resolve", outcome: "for_provider", amountMinor: 40_000 }, actor: "admin" }, ...both("job-dispute-resolved")],
  ],
];

describe("job state machine: the whole state × event × actor space", () => {
  it("samples every event the machine has", () => {
    expect(new Set(Object.values(SAMPLES).map((e) => e.type))).toEqual(new Set(JOB_EVENTS));
  });

  const legal = new Map(LEGAL.map(([state, sample, actor, next, effects]) => [`${state} ${sample} ${actor}`, { next, effects }]));
  const legalPairs = new Set(LEGAL.map(([state, sample]) => `${state} ${sample}`));

  it(`allows exactly the ${LEGAL.length} listed moves among ${JOB_STATES.length} × ${Object.keys(SAMPLES).length} × ${JOB_ACTORS.length}`, () => {
    let allowed = 0;
    for (const state of JOB_STATES) {
      for (const [sample, event] of Object.entries(SAMPLES)) {
        for (const actor of JOB_ACTORS) {
          const result = jobTransition(jobIn(state), event, { actor: ACTORS[actor], now: nowFor(sample) });
          const label = `${state} + ${sample} by ${actor}`;
          const expected = legal.get(`${state} ${sample} ${actor}`);
          if (expected) {
            allowed++;
            expect(result, label).toMatchObject({ ok: true });
            if (!result.ok) continue;
            expect(result.next.state, label).toBe(expected.next);
            expect(result.effects, label).toEqual(expected.effects);
          } else {
            expect(result, label).toMatchObject({ ok: false, reason: legalPairs.has(`${state} ${sample}`) ? "forbidden_actor" : "illegal_transition" });
          }
        }
      }
    }
    expect(allowed).toBe(LEGAL.length);
  });

  it("refuses a farmer or builder who is not party to the job", () => {
    const strangers: Partial<Record<JobActorRole, JobActor>> = { farmer: { role: "farmer", userId: "farmer-2" }, builder: { role: "builder", userId: "builder-2" } };
    let checked = 0;
    for (const [state, sample, role] of LEGAL) {
      const stranger = strangers[role];
      const event = SAMPLES[sample];
      if (!stranger || !event) continue;
      checked++;
      expect(jobTransition(jobIn(state), event, { actor: stranger, now: nowFor(sample) }), `${state} ${sample}`).toMatchObject({ ok: false, reason: "not_party" });
    }
    // arrive, 2 cancels, mark_built, 2 disputes, confirm
    expect(checked).toBe(7);
  });
});

describe("job guards", () => {
  const at = (job: Job, event: JobEvent, role: JobActorRole, iso: string, deltaMs = 0) =>
    jobTransition(job, event, { actor: ACTORS[role], now: new Date(new Date(iso).getTime() + deltaMs) });
  const confirmAt = "2025-04-17T16:00:00.000Z"; // built 10 Apr 16:00 + 7 days

  it("confirms itself 7 days after the build, and disputes close at that moment", () => {
    expect(at(jobIn("built"), { type: "auto_confirm" }, "system", confirmAt, -1)).toMatchObject({ ok: false, reason: "too_early" });
    expect(at(jobIn("built"), { type: "auto_confirm" }, "system", confirmAt)).toMatchObject({ ok: true });
    expect(at(jobIn("built"), { type: "dispute" }, "farmer", confirmAt, -1)).toMatchObject({ ok: true });
    expect(at(jobIn("built"), { type: "dispute" }, "farmer", confirmAt)).toMatchObject({ ok: false, reason: "too_late" });
    // The farmer may still confirm after the window: same outcome as the sweep, one step sooner.
    expect(at(jobIn("built"), { type: "confirm" }, "farmer", confirmAt, 86_400_000)).toMatchObject({ ok: true });
  });

  it("needs a photo to mark the tank built", () => {
    expect(at(jobIn("on_site"), { type: "mark_built", photoCount: 0 }, "builder", confirmAt)).toMatchObject({ ok: false, reason: "missing_photos" });
    const built = at(jobIn("on_site"), { type: "mark_built", photoCount: 1 }, "builder", confirmAt);
    expect(built.ok && [built.next.builtAt, built.next.completionPhotoCount]).toEqual([new Date(confirmAt), 1]);
  });

  it("splits a disputed deposit only into two non-empty parts, and records the resolution", () => {
    for (const releaseMinor of [0, DEPOSIT, DEPOSIT + 1, 1.5]) {
      expect(at(jobIn("disputed"), { type: "resolve", outcome: "split", releaseMinor }, "admin", confirmAt), String(releaseMinor)).toMatchObject({ ok: false, reason: "invalid_amount" });
    }
    const split = at(jobIn("disputed"), { type: "resolve", outcome: "split", releaseMinor: DEPOSIT - 1 }, "admin", confirmAt);
    expect(split.ok && split.next.resolution).toEqual({ outcome: "split", releaseMinor: DEPOSIT - 1 });
  });

  it("refuses a job a builder would take from itself, or one without a held deposit", () => {
    expect(() => newJob({ farmerId: "a", builderId: "a", currency: "ZMW", depositMinor: 100 })).toThrow(RangeError);
    expect(() => newJob({ farmerId: "a", builderId: "b", currency: "ZMW", depositMinor: 0 })).toThrow(RangeError);
  });
});

describe("job paths (random event sequences)", () => {
  const NATURAL: Record<JobEvent["type"], JobActorRole> = {
    arrive: "builder",
    mark_built: "builder",
    confirm: "farmer",
    auto_confirm: "system",
    dispute: "farmer",
    resolve: "admin",
    cancel: "farmer",
  };
  // Weighted so that paths reach every ending: confirmation, the sweep, a cancel, and each kind of resolution.
  const event: fc.Arbitrary<JobEvent> = fc.oneof(
    { weight: 3, arbitrary: fc.constantFrom<JobEvent>({ type: "arrive" }, { type: "confirm" }, { type: "auto_confirm" }) },
    { weight: 2, arbitrary: fc.record({ type: fc.constant("mark_built" as const), photoCount: fc.integer({ min: 0, max: 3 }) }) },
    { weight: 2, arbitrary: fc.constant<JobEvent>({ type: "dispute" }) },
    { weight: 1, arbitrary: fc.constant<JobEvent>({ type: "cancel" }) },
    {
      weight: 3,
      arbitrary: fc.oneof(
        fc.constantFrom<JobEvent>({ type: "resolve", outcome: "for_farmer" }, { type: "resolve", outcome: "for_builder" }),
        fc.record({ type: fc.constant("resolve" as const), outcome: fc.constant("split" as const), releaseMinor: fc.integer({ min: -1, max: 200_000 }) }),
      ),
    },
  );
  const scenario = fc.record({
    depositMinor: fc.integer({ min: 2, max: 200_000 }),
    steps: fc.array(
      fc.record({
        event,
        role: fc.oneof({ weight: 3, arbitrary: fc.constant("natural" as const) }, { weight: 1, arbitrary: fc.constantFrom(...JOB_ACTORS) }),
        advanceMs: fc.integer({ min: 0, max: 3 * 86_400_000 }),
      }),
      { maxLength: 40, size: "max" },
    ),
  });

  it("settles the deposit exactly once when a job ends, as the outcome says; every hold move is accepted and the books balance", () => {
    const reached = new Map<string, number>();
    fc.assert(
      fc.property(scenario, ({ depositMinor, steps }) => {
        let now = new Date("2025-04-07T07:00:00.000Z");
        let job = newJob({ farmerId: FARMER, builderId: BUILDER, currency: "ZMW", depositMinor });
        const authorised = holdTransition(newHold({ holdId: "j1", currency: "ZMW", amountMinor: depositMinor }), { type: "authorize", amountMinor: depositMinor, currency: "ZMW" }, "system");
        if (!authorised.ok) throw new Error(authorised.message);
        let hold: DepositHold = authorised.next;
        const ledger: LedgerEntry[] = authorised.effects.flatMap((e) => (e.kind === "ledger" ? entriesFor(e.movement) : []));
        let settlements = 0;

        for (const s of steps) {
          now = new Date(now.getTime() + s.advanceMs);
          const role = s.role === "natural" ? NATURAL[s.event.type] : s.role;
          const result = jobTransition(job, s.event, { actor: ACTORS[role], now });
          if (!result.ok) continue;
          job = result.next;
          for (const e of result.effects) {
            if (e.kind !== "hold") continue;
            const moved = holdTransition(hold, e.event, e.actor);
            expect(moved, `hold ${hold.state} + ${e.event.type}`).toMatchObject({ ok: true });
            if (!moved.ok) continue;
            hold = moved.next;
            for (const h of moved.effects) {
              if (h.kind !== "ledger") continue;
              ledger.push(...entriesFor(h.movement));
              if (h.movement.kind !== "hold") settlements++;
            }
          }
        }

        const ended = ["completed", "resolved", "cancelled"].includes(job.state);
        expect(settlements).toBe(ended ? 1 : 0);
        assertBalanced(ledger);
        const zmw = balances(ledger).ZMW ?? { farmer_funds: 0, platform_holding: 0, provider_payable: 0, platform_fee: 0 };
        // What the builder should have, worked out from the outcome alone.
        let toBuilder = 0;
        if (job.state === "completed") toBuilder = depositMinor;
        if (job.resolution?.outcome === "for_builder") toBuilder = depositMinor;
        if (job.resolution?.outcome === "split") toBuilder = job.resolution.releaseMinor;
        expect(zmw.provider_payable).toBe(toBuilder);
        expect(zmw.platform_holding).toBe(ended ? 0 : depositMinor);
        expect(zmw.farmer_funds + zmw.provider_payable + zmw.platform_holding).toBe(0);
        reached.set(job.resolution?.outcome ?? job.state, (reached.get(job.resolution?.outcome ?? job.state) ?? 0) + 1);
      }),
      { numRuns: 500 },
    );
    for (const key of ["completed", "cancelled", "for_farmer", "for_builder", "split"]) expect(reached.get(key) ?? 0, key).toBeGreaterThanOrEqual(5);
  });
});
