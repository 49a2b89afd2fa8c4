import { describe, expect, it } from "vitest";
import { resultInWords } from "@/lib/offline/outbox-results";
import { SIGHTING_REASONS } from "@/lib/sync/sightings";
import { VISIT_REASONS } from "@/lib/sync/visits";

// What a volunteer reads when the server refuses an item: sentences, never the protocol's
// field names (visitId, visitDate) or its technical words (issue 10, "Our own words").
describe("the server's answer for one item, in the volunteer's words", () => {
  it("says the reason and each field's message once, without the field names", () => {
    const words = resultInWords({
      kind: "visit",
      id: "5b4c3d2e-1f0a-4b9c-8d7e-6f5a4b3c2d1e",
      index: 0,
      status: "invalid",
      reason: "No season takes walks on that day.",
      errors: { visitDate: ["No season takes walks on that day."], endTime: ["The walk cannot end before it starts."] },
    });
    expect(words).toBe("No season takes walks on that day. The walk cannot end before it starts.");
  });

  it("words an orphan sighting without the field name or the old words", () => {
    const words = resultInWords({ kind: "sighting", id: "6c5d4e3f-2a1b-4c0d-9e8f-7a6b5c4d3e2f", index: 0, status: "invalid", reason: SIGHTING_REASONS.unknownVisit, errors: { visitId: ["Send the walk first, or correct it if it was refused."] } });
    expect(words).toBe("Turnstone does not have this sighting's walk. Send the walk first, or correct it if it was refused.");
    expect(words).not.toMatch(/visitId|visit|server|outbox|record/i);
  });

  it("has a sentence for an answer with neither reason nor messages", () => {
    expect(resultInWords({ kind: "sighting", id: "6c5d4e3f-2a1b-4c0d-9e8f-7a6b5c4d3e2f", index: 0, status: "invalid" })).toBe("Turnstone could not take this as it is.");
  });

  it("keeps the old vocabulary out of every reason a walk or a sighting can be given", () => {
    for (const reason of [...Object.values(SIGHTING_REASONS), ...Object.values(VISIT_REASONS)]) expect(reason).not.toMatch(/checker|coordinator|visit|server|record/i);
    expect(VISIT_REASONS.reviewed).toBe("A reviewer has reviewed sightings on this walk, so the walk stays as Turnstone has it.");
  });
});
