// Which builders a tank request reaches, against a migrated temp database. Expected sets are worked out here with
// GeographicLib (C. F. F. Karney, "Algorithms for geodesics", J. Geodesy 87:43-55, 2013), not with the app's own
// distance code: a site 1 m inside a radius must reach the builder, 1 m outside must not.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { referenceDestination, referenceDistance } from "@/lib/geo/geographiclib.test-helper";
import { addPerson, mailSubjects, requestForm, useJobsEnvironment, type Stand } from "./jobs-fixtures";

let stand: Stand;
let requests: typeof import("@/lib/requests/request-service");
let views: typeof import("@/lib/requests/request-views");
let schema: typeof import("@/lib/validations/tank-requests");

beforeAll(async () => {
  stand = await useJobsEnvironment();
  requests = await import("@/lib/requests/request-service");
  views = await import("@/lib/requests/request-views");
  schema = await import("@/lib/validations/tank-requests");
});
afterAll(async () => stand.close());

const parse = (form: Record<string, string>) => schema.tankRequestFormSchema.parse(form);

describe("a request reaches exactly the builders whose service radius covers the site", () => {
  it("includes a builder 1 m inside the radius and leaves one 1 m outside, in every direction", async () => {
    // Each case has its own region (2° apart) so builders of one case are far from the others' sites.
    const azimuths = [0, 90, 137.5, 180, 271];
    for (const [k, azimuth] of azimuths.entries()) {
      const base = { lat: -14 + 2 * k, lng: 28.3 };
      const builder = await addPerson({ roles: ["builder"], at: base, radiusKm: 30 });
      const inside = referenceDestination(base.lat, base.lng, azimuth, 30_000 - 1);
      const outside = referenceDestination(base.lat, base.lng, azimuth, 30_000 + 1);
      const farmer = await addPerson({ roles: ["farmer"], at: inside });

      const near = await requests.postTankRequest(farmer.id, parse(requestForm(inside)));
      const reached = near.reached.find((r) => r.builderId === builder.id);
      expect(reached, `azimuth ${azimuth}: 29 999 m from a 30 km radius`).toBeDefined();
      // The distance shown (and priced) agrees with GeographicLib to 1 mm.
      expect(Math.abs((reached?.distanceM ?? 0) - referenceDistance(base.lat, base.lng, inside.lat, inside.lng))).toBeLessThan(1e-3);

      const far = await requests.postTankRequest(farmer.id, parse(requestForm(outside)));
      expect(far.reached.map((r) => r.builderId), `azimuth ${azimuth}: 30 001 m`).not.toContain(builder.id);

      // The builder's own list shows the same: the inside request with its distance, never the outside one.
      const list = await views.openRequestsForBuilder(builder.id);
      expect(list.requests.map((r) => r.id)).toContain(near.id);
      expect(list.requests.map((r) => r.id)).not.toContain(far.id);
    }
  });

  it("reaches the covering builders and no one else, and writes to each of them once", async () => {
    const site = { lat: -25.5, lng: 27.9 };
    const at = (azimuth: number, km: number) => referenceDestination(site.lat, site.lng, azimuth, km * 1000);
    const people = {
      near: await addPerson({ roles: ["builder"], at: at(10, 12), radiusKm: 30 }),
      wide: await addPerson({ roles: ["builder"], at: at(200, 45), radiusKm: 50 }),
      tooSmall: await addPerson({ roles: ["builder"], at: at(90, 15), radiusKm: 10 }),
      rejected: await addPerson({ roles: ["builder"], at: at(0, 2), radiusKm: 30, state: "rejected" }),
      pending: await addPerson({ roles: ["builder"], at: at(300, 5), radiusKm: 30, state: "pending" }),
      noBase: await addPerson({ roles: ["builder"], at: null, radiusKm: 1000 }),
      // builder terms left over from a role the account no longer holds
      formerBuilder: await addPerson({ roles: ["farmer"], at: at(45, 1), radiusKm: 30, builderRow: true }),
      hatchery: await addPerson({ roles: ["hatchery"], at: at(45, 1) }),
    };
    // The farmer also builds tanks, right at the site: never reached by their own request.
    const farmer = await addPerson({ roles: ["farmer", "builder"], at: site, radiusKm: 100 });

    const posted = await requests.postTankRequest(farmer.id, parse(requestForm(site)));
    const expected = Object.entries(people)
      .filter(([name]) => ["near", "wide", "pending"].includes(name))
      .map(([, p]) => p.id)
      .sort();
    expect(posted.reached.map((r) => r.builderId).sort()).toEqual(expected);
    // Nearest first: 5 km, 12 km, 45 km.
    expect(posted.reached.map((r) => r.builderId)).toEqual([people.pending.id, people.near.id, people.wide.id]);

    for (const [name, p] of Object.entries(people)) {
      const subjects = (await mailSubjects(stand.mailUrl, p.email)).filter((s) => s.startsWith("New tank request"));
      expect(subjects.length, name).toBe(expected.includes(p.id) ? 1 : 0);
    }
    expect(await mailSubjects(stand.mailUrl, farmer.email)).toEqual([]);
  });

  it("stores nothing twice when the same form is posted again", async () => {
    const site = { lat: -20, lng: 25 };
    const builder = await addPerson({ roles: ["builder"], at: referenceDestination(site.lat, site.lng, 0, 5000), radiusKm: 30 });
    const farmer = await addPerson({ roles: ["farmer"], at: site });
    const form = requestForm(site);
    const first = await requests.postTankRequest(farmer.id, parse(form));
    const again = await requests.postTankRequest(farmer.id, parse(form));
    expect(first.created).toBe(true);
    expect(again).toEqual({ id: first.id, created: false, reached: [] });
    expect((await views.listFarmerRequests(farmer.id)).length).toBe(1);
    expect((await mailSubjects(stand.mailUrl, builder.email)).length).toBe(1);
    // Another farmer cannot take over the id.
    const other = await addPerson({ roles: ["farmer"], at: site });
    await expect(requests.postTankRequest(other.id, parse(form))).rejects.toThrow("already used");
  });

  it("refuses bad input with a message per field, and stores nothing", async () => {
    const farmer = await addPerson({ roles: ["farmer"], at: { lat: -15, lng: 28 } });
    const bad = schema.tankRequestFormSchema.safeParse(requestForm({ lat: -15, lng: 28 }, { unit: "ft", length: "0.5", width: "", lat: "95", wantedBy: "2001-01-01" }));
    expect(bad.success).toBe(false);
    const fields = Object.fromEntries((bad.error?.issues ?? []).map((i) => [i.path.join("."), i.message]));
    // 0.3 m = 0.98 ft and 100 m = 328.1 ft (1 ft = 0.3048 m exactly, REFERENCE-VALUES 10.2).
    expect(fields.length).toBe("Length must be a number between 1 ft and 328.1 ft");
    expect(fields.width).toBe("Enter the width");
    expect(fields.lat).toBe("Latitude must be between -90 and 90 degrees");
    expect(fields.wantedBy).toBe("Choose today or a later date");
    expect(await views.listFarmerRequests(farmer.id)).toEqual([]);
  });

  it("converts feet to metres exactly (1 ft = 0.3048 m)", () => {
    const form = requestForm({ lat: -15, lng: 28 }, { unit: "ft", shape: "round", length: "", width: "", diameter: "10", depth: "3" });
    const parsed = parse(form);
    // REFERENCE-VALUES 10.2: 10 ft = 3.048 m, 3 ft = 0.9144 m.
    expect(parsed.size).toEqual({ shape: "round", diameterM: 3.048, depthM: 0.9144, sizeUnit: "ft" });
  });
});
