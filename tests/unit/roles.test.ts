import { describe, expect, it } from "vitest";
import { roleHome, roles, rolesForPath } from "@/lib/auth/roles";

describe("role areas", () => {
  it("each role's home belongs to that role alone", () => {
    for (const role of roles) {
      expect(rolesForPath(roleHome[role])).toEqual([role]);
    }
  });

  it("matches sub-pages but not look-alike prefixes", () => {
    expect(rolesForPath("/network/people")).toEqual(["organiser"]);
    expect(rolesForPath("/fieldwork")).toBeNull();
    expect(rolesForPath("/safety")).toBeNull();
  });
});
