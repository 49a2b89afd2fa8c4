import { describe, expect, it } from "vitest";
import { areas, areasFor, hasRole, homeFor, normaliseRoles, REVIEWERS, roleLabel, roles, rolesForPath, rolesInWords } from "@/lib/auth/roles";

describe("role areas", () => {
  it("each role has exactly one home it lands on alone, and that area admits it", () => {
    for (const role of roles) {
      const home = homeFor([role]);
      expect(rolesForPath(home)).toContain(role);
      expect(areasFor([role]).map((a) => a.home)).toContain(home);
    }
    expect(new Set(roles.map((r) => homeFor([r]))).size).toBe(roles.length);
  });

  it("organisers have every reviewer power: the review area admits coordinators and organisers, and nobody else", () => {
    expect([...rolesForPath("/review")!].sort()).toEqual(["coordinator", "organiser"]);
    expect(REVIEWERS).toEqual(["coordinator", "organiser"]);
    expect(areasFor(["organiser"]).map((a) => a.home)).toEqual(["/network", "/review"]);
    expect(areasFor(["volunteer"]).map((a) => a.home)).toEqual(["/field"]);
    expect(areasFor(["partner"]).map((a) => a.home)).toEqual(["/data"]);
  });

  it("a person with two roles has both areas and nothing more, and lands on the first", () => {
    expect(areasFor(["volunteer", "coordinator"]).map((a) => a.home)).toEqual(["/review", "/field"]);
    expect(homeFor(["volunteer", "coordinator"])).toBe("/review");
    expect(homeFor(["volunteer", "organiser"])).toBe("/network");
    expect(areasFor(["volunteer", "partner"]).map((a) => a.home)).toEqual(["/field", "/data"]);
  });

  it("matches sub-pages but not look-alike prefixes", () => {
    expect(rolesForPath("/network/people")).toEqual(["organiser"]);
    expect(rolesForPath("/fieldwork")).toBeNull();
    expect(rolesForPath("/safety")).toBeNull();
    expect(areas.every((a) => a.roles.length > 0)).toBe(true);
  });

  it("hasRole is true when the person holds any of the roles asked for", () => {
    expect(hasRole({ roles: ["volunteer", "partner"] }, "organiser", "partner")).toBe(true);
    expect(hasRole({ roles: ["volunteer"] }, "organiser", "coordinator")).toBe(false);
    expect(hasRole({ roles: [] }, ...roles)).toBe(false);
  });

  it("role lists lose repeats and keep one order; a sentence names them all", () => {
    expect(normaliseRoles(["partner", "volunteer", "partner"])).toEqual(["volunteer", "partner"]);
    expect(rolesInWords(["organiser", "volunteer"])).toBe("volunteer recorder and network organiser");
    expect(rolesInWords(["partner"])).toBe("partner scientist");
    expect(rolesInWords(["coordinator", "volunteer"])).toBe("volunteer recorder and reviewer");
  });

  it("calls the coordinator role a reviewer and its area Reviewing (our own words, issue 10)", () => {
    expect(roleLabel.coordinator).toBe("Reviewer");
    expect(areas.find((a) => a.home === "/review")!.label).toBe("Reviewing");
    expect(Object.values(roleLabel).join(" ") + areas.map((a) => a.label).join(" ")).not.toMatch(/check/i);
  });
});
