import { describe, expect, it } from "vitest";
import { inviteSchema } from "@/app/(network)/network/people/schema";
import { startVisitSchema } from "@/lib/field/visit-form";

// PostgreSQL cannot store NUL in text (its manual, "Character Types") and refuses year 0000
// (tests/integration/sync.test.ts shows both): the forms refuse them with a message instead.
const visit = { transectId: "6f1c1f7e-2b7a-4c1e-9a55-5d2f0c7b9a10", visitDate: "2026-06-14", startTime: "10:30", temperatureC: "", windBeaufort: "", cloudCoverPercent: "", sky: "", coRecorders: "" };

describe("free text and dates in the organiser's and the volunteer's forms", () => {
  it("refuses NUL and broken characters in a person's name, and still takes an ordinary one", () => {
    const base = { email: "ana@example.org", roles: ["volunteer" as const] };
    expect(inviteSchema.safeParse({ ...base, name: "Ana\u0000" }).success).toBe(false);
    expect(inviteSchema.safeParse({ ...base, name: "Ana \ud800" }).success).toBe(false);
    expect(inviteSchema.safeParse({ ...base, name: "A" }).success).toBe(false);
    expect(inviteSchema.safeParse({ ...base, name: "  Ana Ferreira  " })).toMatchObject({ success: true, data: { name: "Ana Ferreira" } });
  });

  it("refuses a visit dated year 0000 or far in the future, and co-recorders with NUL", () => {
    expect(startVisitSchema.safeParse(visit).success).toBe(true);
    expect(startVisitSchema.safeParse({ ...visit, visitDate: "0000-06-14" }).success).toBe(false);
    expect(startVisitSchema.safeParse({ ...visit, visitDate: "2999-06-14" }).success).toBe(false);
    expect(startVisitSchema.safeParse({ ...visit, coRecorders: "Bo\u0000" }).success).toBe(false);
    expect(startVisitSchema.safeParse({ ...visit, coRecorders: "Bo Lindqvist" })).toMatchObject({ success: true, data: { coRecorders: "Bo Lindqvist" } });
  });
});
