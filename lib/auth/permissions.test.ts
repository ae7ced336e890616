import { describe, expect, it } from "vitest";
import { ROLES, type Role } from "@/lib/catalog";
import { PERMISSIONS, can, canEditProfile, decide, isProvider, type Permission } from "./permissions";

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
