import { describe, expect, it } from "vitest";
import { hashPair } from "../../../lib/change/fingerprint";

const hexOf = (text: string) => {
  const hash = hashPair();
  hash.add(new TextEncoder().encode(text));
  return hash.hex();
};

describe("the comparison fingerprint's hash", () => {
  // FNV-1a test values (from memory, as listed with the FNV reference code by Fowler, Noll and
  // Vo): 32-bit FNV-1a of "" is 811c9dc5, of "a" e40c292c, of "foobar" bf9cf968; 64-bit FNV-1a
  // of "a" is af63dc4c8601ec8c.
  it("its first half is 32-bit FNV-1a", () => {
    expect(hexOf("").slice(0, 8)).toBe("811c9dc5");
    expect(hexOf("a").slice(0, 8)).toBe("e40c292c");
    expect(hexOf("foobar").slice(0, 8)).toBe("bf9cf968");
  });

  it("is 16 hex digits but not 64-bit FNV-1a", () => {
    expect(hexOf("a")).toMatch(/^[0-9a-f]{16}$/);
    expect(hexOf("a")).not.toBe("af63dc4c8601ec8c");
  });
});
