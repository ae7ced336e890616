import fc from "fast-check";
import { defaultPlanInput } from "@/lib/validations/planner";

// What tests/e2e/fuzz.spec.ts throws at each JSON route: generated with fast-check, from a valid body of the route
// (SAMPLES, when it takes one) bent out of shape, or from nothing at all. Every case knows how to describe itself
// briefly, so a failure report names the case without printing a 150 KB string.

export type FuzzCase = {
  label: string;
  query: string;
  contentType: string | undefined;
  idempotencyKey: string | undefined;
  body: string | Buffer | undefined;
};

const NO_ID = "00000000-0000-4000-8000-000000000000";
const day = (offset: number) => new Date(Date.now() + offset * 86_400_000).toISOString().slice(0, 10);

const tankSize = { tankType: "tarpaulin", shape: "rectangular", unit: "m", length: "4", width: "2", diameter: "", depth: "1", lat: "-15.41", lng: "28.29" };
const batch = { species: "tilapia", meanWeightG: "3", meanLengthCm: "5", countAvailable: "500", pricePerFish: "1.50", currency: "ZMW", readyFrom: day(0), sellBy: day(20), delivery: "both" };
const quote = { scope: "turnkey", note: "", lines: [{ kind: "materials", description: "Liner and frame", quantity: "1", unitPrice: "450" }] };

/**
 * A valid body per route and method (the shapes of lib/validations/*), keyed "METHOD /api/v1/…". A route missing
 * here is still fuzzed, with generated JSON and non-JSON bodies only.
 */
export const SAMPLES: Record<string, Record<string, unknown>> = {
  "POST /api/v1/admin/providers/[id]/verification": { decision: "verified", note: "Ponds and records checked" },
  "POST /api/v1/batches": batch,
  "PUT /api/v1/batches/[id]": batch,
  "POST /api/v1/batches/[id]/state": { action: "pause" },
  "POST /api/v1/jobs/[id]/deposit": { paymentMethod: "pm_card_visa" },
  "POST /api/v1/jobs/[id]/events": { type: "dispute", reason: "The liner leaks at one corner" },
  "POST /api/v1/onboarding": { roles: ["farmer"], displayName: "Fuzz Farmer", region: "Lusaka", phone: "", about: "" },
  "POST /api/v1/plans": { name: "Fuzz plan", input: defaultPlanInput },
  "PUT /api/v1/plans/[id]": { name: "Fuzz plan", input: defaultPlanInput },
  "POST /api/plans/estimate": defaultPlanInput,
  "POST /api/v1/portfolio": { id: NO_ID, ...tankSize, placeName: "Chongwe", completedOn: day(-30), caption: "" },
  "PUT /api/v1/providers/[id]/builder": { serviceRadiusKm: 60, currency: "ZMW", baseFeeMinor: 50_000, travelRatePerKmMinor: 500, prices: [{ tankType: "tarpaulin", materialsPerSqmMinor: 9_000, labourPerSqmMinor: 4_000 }] },
  "PUT /api/v1/providers/[id]/hatchery": { species: ["tilapia"], delivers: true, deliveryRadiusKm: 25 },
  "POST /api/v1/quotes/[id]/accept": { version: 1 },
  "PUT /api/v1/quotes/[id]": quote,
  "POST /api/v1/tank-requests/[id]/quotes": quote,
  "POST /api/v1/reservations": { batchId: NO_ID, count: 10, handoverMethod: "pickup", note: "" },
  "POST /api/v1/reservations/[id]/actions": { action: "cancel", reason: "Plans changed" },
  "POST /api/v1/reservations/[id]/pay": { paymentMethod: "pm_card_visa" },
  "POST /api/v1/tank-requests": { id: NO_ID, ...tankSize, readiness: "compacted_ground", waterSource: "borehole", power: "none", wantedBy: day(30), planId: "", notes: "" },
  "POST /api/v1/uploads/presign": { kind: "site-photo", subjectId: NO_ID, contentType: "image/jpeg", contentLength: 200_000 },
  "POST /api/v1/uploads/complete": { kind: "site-photo", subjectId: NO_ID, uploadId: NO_ID },
  // Reviews (lib/validations/reviews.ts)
  "POST /api/v1/reviews": { subjectKind: "job", subjectId: NO_ID, stars: 4, aspects: {}, body: "Built on the day agreed and it holds water.", photoIds: [] },
  "PATCH /api/v1/reviews/[id]": { stars: 3, body: "The liner needed a second visit to fix a fold." },
  "POST /api/v1/reviews/[id]/reply": { body: "Thank you, we are glad the tank serves you well." },
  "POST /api/v1/reviews/[id]/reports": { reason: "spam", details: "" },
  "POST /api/v1/admin/review-reports/[id]/decision": { decision: "keep", note: "Fair criticism" },
};

/** Query keys the routes read (lib/validations/search.ts, reservations.ts, reviews.ts), so generated queries reach the schemas. */
const QUERY_KEYS = ["lat", "lng", "radiusKm", "kind", "tankType", "species", "verified", "readyNow", "sort", "cursor", "limit", "as", "state", "batchId", "q", "dir", "page", "pageSize", "builderId", "strategy", "role", "stars", "aspect", "minAspectStars"];

const HUGE = fc.tuple(fc.constantFrom("a", "🐟", "\u0000", "\uD800", "ف", " "), fc.integer({ min: 100_000, max: 190_000 })).map(([ch, n]) => ch.repeat(Math.ceil(n / ch.length)));

const WEIRD_TEXT = fc.constantFrom(
  "",
  " ",
  "\u0000",
  "a\u0000b",
  "\uD800",
  "\uDFFF",
  "fish\uD83D",
  "🐟🐠🐡🦈",
  "\u202Eevil\u202C",
  "ناصر للأسماك",
  "דגים",
  "\uFEFFbom",
  "' OR 1=1 --",
  "<script>alert(1)</script>",
  "../../etc/passwd",
  "%00",
  "\r\n\r\n",
  "null",
  "NaN",
  "Infinity",
  "-1",
  "1e999",
  "0x10",
  "１２３",
  "2026-02-30",
  "9999-99-99",
  "pm_",
  "00000000-0000-4000-8000-00000000000g",
);

export const nastyString = fc.oneof(WEIRD_TEXT, fc.string({ unit: "binary", maxLength: 120 }), fc.string({ unit: "grapheme", maxLength: 40 }), HUGE);

export const nastyNumber = fc.oneof(
  fc.constantFrom(-1, -0.5, 0.5, -1e308, 1e308, Number.MAX_SAFE_INTEGER + 2, -Number.MAX_SAFE_INTEGER - 2, 5e-324, 2 ** 31, 2 ** 63, 1e21, -2147483649),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
);

const wrongType = fc.oneof(
  fc.constantFrom<unknown>(null, true, false, [], {}, [1, 2, 3], { $gt: "" }, JSON.parse('{"__proto__":{"isAdmin":true}}'), [null], [[[]]]),
  nastyNumber,
  nastyString,
  // Nested values as JS values stay shallow enough for JSON.stringify here; NON_JSON sends far deeper text.
  fc.integer({ min: 100, max: 1200 }).map((depth) => JSON.parse("[".repeat(depth) + "]".repeat(depth)) as unknown),
);

/** Raw number tokens JSON.parse turns into ±Infinity, or refuses: spliced into otherwise valid JSON text. */
const RAW_NUMBER = fc.constantFrom("1e999", "-1e999", "NaN", "Infinity", "0x1F", "01", "1.", "-", "+1", "1e-999");

const NON_JSON = fc.oneof(
  fc.constantFrom("{", "{]", "undefined", "NaN", "'single'", "<xml/>", "a=1&b=2", "\uFEFF{}", '{"a":1}garbage', "null", "[]", '"text"', "0", "true", "{}{}", '{"a":1,"a":"2"}', '{"__proto__":{"isAdmin":true}}'),
  fc.string({ unit: "binary", maxLength: 300 }),
  fc.integer({ min: 1000, max: 60_000 }).map((depth) => "[".repeat(depth) + "]".repeat(depth)),
  fc.integer({ min: 1000, max: 20_000 }).map((depth) => '{"a":'.repeat(depth) + "1" + "}".repeat(depth)),
  fc.constant(" ".repeat(210_000) + "{}"),
);

const CONTENT_TYPES = fc.constantFrom(
  "application/json",
  "application/json; charset=utf-8",
  "text/plain",
  "application/x-www-form-urlencoded",
  "multipart/form-data; boundary=----shoal",
  "application/xml",
  "application/json; charset=utf-16",
  "",
);

/** Idempotency-Key values: mostly valid (so the body is what gets refused), sometimes missing or malformed. */
const IDEMPOTENCY_KEY = fc.oneof(
  { weight: 6, arbitrary: fc.uuid().map((u) => `fuzz-${u}`) },
  { weight: 1, arbitrary: fc.constant(undefined) },
  { weight: 1, arbitrary: fc.constantFrom("short", "has space in it", "x".repeat(300), "semi;colon!!", "ÿÿÿÿÿÿÿÿÿÿ") },
);

function percentEncode(text: string): string {
  // Lone surrogates become U+FFFD here, as a browser would send them; raw bad escapes come from BAD_ESCAPES.
  return Array.from(Buffer.from(text, "utf8"), (b) => `%${b.toString(16).padStart(2, "0")}`).join("");
}
const BAD_ESCAPES = fc.constantFrom("%", "%zz", "%ED%A0%80", "%00", "%FF%FE", "%C0%AF", "%E2%80%AE");

const queryValue = fc.oneof(
  fc.constantFrom("-15.4", "28.3", "50", "farmer", "hatchery", "all", "true", "1", NO_ID).map(encodeURIComponent),
  nastyNumber.map((n) => encodeURIComponent(String(n))),
  fc.oneof(WEIRD_TEXT, fc.string({ unit: "binary", maxLength: 60 })).map(percentEncode),
  BAD_ESCAPES,
  fc.integer({ min: 1000, max: 4000 }).map((n) => "9".repeat(n)),
);

/** A query string (without "?"): known and unknown keys, repeated keys, bad escapes. */
export const queryString = fc
  .array(fc.tuple(fc.oneof({ weight: 3, arbitrary: fc.constantFrom(...QUERY_KEYS) }, { weight: 1, arbitrary: fc.string({ maxLength: 12 }).map(percentEncode) }), queryValue), { maxLength: 6 })
  .map((pairs) => pairs.map(([k, v]) => `${k}=${v}`).join("&"));

const MARK = "__fuzz_raw_token__";
const DROP = Symbol("drop");

/** Every path into a body, down to three levels: ["input", "tank", "waterDepthM"], ["lines", "0", "quantity"]… */
function pathsOf(value: unknown, prefix: string[] = []): string[][] {
  if (prefix.length > 3 || typeof value !== "object" || value === null) return [];
  const entries: [string, unknown][] = Array.isArray(value) ? value.map((v, i): [string, unknown] => [String(i), v]) : Object.entries(value);
  return entries.flatMap(([k, v]) => [[...prefix, k], ...pathsOf(v, [...prefix, k])]);
}

/** A copy of `body` with the value at `path` replaced (or removed, for DROP). */
function withValueAt(body: unknown, path: string[], replacement: unknown): unknown {
  const copy: unknown = structuredClone(body);
  let at: unknown = copy;
  for (const key of path.slice(0, -1)) at = (at as Record<string, unknown>)[key];
  const last = path.at(-1);
  if (last === undefined || typeof at !== "object" || at === null) return copy;
  if (replacement === DROP) {
    if (Array.isArray(at)) at.splice(Number(last), 1);
    else delete (at as Record<string, unknown>)[last];
  } else {
    (at as Record<string, unknown>)[last] = replacement;
  }
  return copy;
}

/** The sample bent one way: fields dropped, one value anywhere in it replaced, unknown fields added, or a raw token spliced in. */
function mutatedSample(sample: Record<string, unknown>): fc.Arbitrary<{ label: string; text: string }> {
  const keys = Object.keys(sample);
  const path = fc.constantFrom(...pathsOf(sample));
  const missingTop = fc.subarray(keys, { minLength: 1 }).map((drop) => ({
    label: `missing ${drop.join(", ")}`,
    text: JSON.stringify(Object.fromEntries(Object.entries(sample).filter(([k]) => !drop.includes(k)))),
  }));
  const missingDeep = path.map((p) => ({ label: `missing ${p.join(".")}`, text: JSON.stringify(withValueAt(sample, p, DROP)) }));
  const replaced = fc.tuple(path, wrongType).map(([p, value]) => ({ label: `${p.join(".")} replaced`, text: JSON.stringify(withValueAt(sample, p, value)) }));
  const extra = fc
    .tuple(fc.constantFrom("userId", "ownerId", "farmerId", "role", "roles", "verificationState", "state", "priceMinor", "createdAt", "id"), wrongType)
    .map(([key, value]) => ({ label: `extra ${key}`, text: JSON.stringify({ ...sample, [key]: value }) }));
  const raw = fc.tuple(path, RAW_NUMBER).map(([p, token]) => ({ label: `${p.join(".")} = ${token} (raw)`, text: JSON.stringify(withValueAt(sample, p, MARK)).replace(`"${MARK}"`, token) }));
  return fc.oneof(missingTop, missingDeep, replaced, replaced, replaced, extra, raw);
}

/** Every kind of case for one route and method; `takesBody` false for GET and for routes that read no body. */
export function fuzzCases(sample: Record<string, unknown> | undefined, takesBody: boolean): fc.Arbitrary<FuzzCase> {
  const json = fc.jsonValue({ maxDepth: 4 }).map((v) => ({ label: "random JSON", text: JSON.stringify(v) ?? "null" }));
  const nonJson = NON_JSON.map((text) => ({ label: "not JSON", text }));
  const textBodies = sample ? fc.oneof({ weight: 5, arbitrary: mutatedSample(sample) }, { weight: 2, arbitrary: json }, { weight: 2, arbitrary: nonJson }) : fc.oneof(json, nonJson);
  const bytes = fc.uint8Array({ minLength: 1, maxLength: 4000 }).map((b) => ({ label: "random bytes", bytes: Buffer.from(b) }));
  const body = takesBody
    ? fc.oneof({ weight: 8, arbitrary: textBodies }, { weight: 1, arbitrary: bytes })
    : fc.oneof({ weight: 4, arbitrary: fc.constant(undefined) }, { weight: 1, arbitrary: textBodies });
  return fc
    .record({
      body,
      query: fc.oneof({ weight: takesBody ? 3 : 1, arbitrary: fc.constant("") }, { weight: 2, arbitrary: queryString }),
      contentType: fc.oneof({ weight: 4, arbitrary: fc.constant("application/json") }, { weight: 2, arbitrary: CONTENT_TYPES }, { weight: 1, arbitrary: fc.constant(undefined) }),
      idempotencyKey: IDEMPOTENCY_KEY,
    })
    .map(({ body: b, query, contentType, idempotencyKey }): FuzzCase => {
      const payload = b === undefined ? undefined : "bytes" in b ? b.bytes : b.text;
      const size = payload === undefined ? 0 : payload.length;
      const label = `${b?.label ?? "no body"} (${size} ${Buffer.isBuffer(payload) ? "bytes" : "chars"})${query ? ` ?${query.slice(0, 80)}${query.length > 80 ? "…" : ""}` : ""} [${contentType ?? "no content-type"}]`;
      const described = { label, query, contentType, idempotencyKey, body: payload };
      // fast-check prints this instead of the whole value when a case fails.
      return Object.assign(described, { [fc.toStringMethod]: () => label });
    });
}
