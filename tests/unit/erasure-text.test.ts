import { describe, expect, it } from "vitest";
import { asJsonText, escapeRegex, wholePattern, withoutName } from "@/lib/people/erasure-text";

describe("text helpers for erasing a person", () => {
  it("escapes every character PostgreSQL's regular expressions give a meaning (PostgreSQL docs 9.7.3.1)", () => {
    const special = "\\^$.|?*+()[]{}";
    expect(escapeRegex(special)).toBe(special.split("").map((c) => `\\${c}`).join(""));
    expect(escapeRegex("ann.o'neil@example.org")).toBe("ann\\.o'neil@example\\.org");
    expect(wholePattern("A. Lee")).toBe("(?<![[:alnum:]_])A\\. Lee(?![[:alnum:]_])");
  });

  it("writes a name as it appears inside a JSON document (RFC 8259 §7 string escapes)", () => {
    expect(asJsonText('Ann "Nan" Lee')).toBe('Ann \\"Nan\\" Lee');
    expect(asJsonText("Zoë")).toBe("Zoë");
  });

  it("takes one name out of a walked-with line and keeps everyone else", () => {
    expect(withoutName("Ann Lee, Bo Chan", "Ann Lee")).toBe("Bo Chan");
    expect(withoutName("bo chan and  ANN  LEE; Cy Dale", "Ann Lee")).toBe("bo chan, Cy Dale");
    expect(withoutName("Ann Lee", "Ann Lee")).toBeNull();
    expect(withoutName("Annabel Lee & Bo", "Ann Lee")).toBe("Annabel Lee, Bo");
    expect(withoutName(null, "Ann Lee")).toBeNull();
  });
});
