import { describe, expect, it } from "vitest";
import { ROLES, type Role } from "@/lib/catalog";
import { PERMISSIONS, can, canEditProfile, canManageBatch, decide, isProvider, reservationRoleOf, type Permission } from "./permissions";

const actor = (roles: Role[], id = "u1") => ({ id, roles });

describe("permission table", () => {
  it("refuses every permission to a signed-out visitor", () => {
    for (const p of Object.keys(PERMISSIONS) as Permission[]) {
      expect(decide(null, p)).toBe("signed-out");
    }
  });

  it("grants each permission exactly to the roles listed, and forbids the rest", () => {
    for (const [p, roles] of Object.entries(PERMISSIONS) as [Permission, readonly Role[]][]) {
      for (const role of ROLES) {
        expect(decide(actor([role]), p), `${role} → ${p}`).toBe(roles.includes(role) ? "allowed" : "forbidden");
      }
    }
  });

  it("treats one account with several roles as holding the union", () => {
    const both = actor(["hatchery", "builder"]);
    expect(can(both, "hatchery:manage")).toBe(true);
    expect(can(both, "builder:manage")).toBe(true);
    expect(can(both, "admin:verify-providers")).toBe(false);
  });

  it("lets owners and admins edit a profile, nobody else", () => {
    expect(canEditProfile(actor(["farmer"], "a"), "a")).toBe(true);
    expect(canEditProfile(actor(["builder"], "b"), "a")).toBe(false);
    expect(canEditProfile(actor(["admin"], "z"), "a")).toBe(true);
    expect(canEditProfile(null, "a")).toBe(false);
  });

  it("knows providers", () => {
    expect(isProvider(["farmer"])).toBe(false);
    expect(isProvider(["farmer", "builder"])).toBe(true);
  });
});

// Issue 4 and DESIGN.md's role table: a hatchery manages its own batches and answers its reservations; a farmer
// follows their own; an admin settles disputes; nobody else sees a reservation.
describe("batches and reservations", () => {
  it("lets a hatchery manage only its own batches", () => {
    expect(canManageBatch(actor(["hatchery"], "h1"), { hatcheryId: "h1" })).toBe(true);
    expect(canManageBatch(actor(["hatchery"], "h2"), { hatcheryId: "h1" })).toBe(false);
    expect(canManageBatch(actor(["farmer"], "h1"), { hatcheryId: "h1" })).toBe(false);
    expect(canManageBatch(actor(["admin"], "a"), { hatcheryId: "h1" })).toBe(false);
    expect(canManageBatch(null, { hatcheryId: "h1" })).toBe(false);
  });

  it("knows each party's part in a reservation, and nobody else's", () => {
    const r = { farmerId: "f", hatcheryId: "h" };
    expect(reservationRoleOf(actor(["farmer"], "f"), r)).toBe("farmer");
    expect(reservationRoleOf(actor(["hatchery"], "h"), r)).toBe("hatchery");
    expect(reservationRoleOf(actor(["admin"], "a"), r)).toBe("admin");
    expect(reservationRoleOf(actor(["farmer"], "other"), r)).toBeNull();
    expect(reservationRoleOf(actor(["builder"], "b"), r)).toBeNull();
    // The party's role is the one that counts: the farmer id without the farmer role is nobody.
    expect(reservationRoleOf(actor(["builder"], "f"), r)).toBeNull();
    // An admin who is also the farmer acts as the farmer, except for admin-only moves.
    expect(reservationRoleOf(actor(["farmer", "admin"], "f"), r)).toBe("farmer");
    expect(reservationRoleOf(actor(["farmer", "admin"], "f"), r, true)).toBe("admin");
    expect(reservationRoleOf(null, r)).toBeNull();
  });
});
