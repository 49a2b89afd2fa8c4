import { describe, expect, it } from "vitest";
import { MAX_RETURN_PATH_LENGTH, safeReturnPath } from "@/lib/auth/return-path";

const APP = "https://turnstone.example.org";

// Source: WHATWG URL Standard (https://url.spec.whatwg.org/), basic URL parser: leading and trailing
// C0 controls and spaces are stripped and every ASCII tab or newline is removed from the input
// (steps 1 and 3); in the "relative slash" and "special authority ignore slashes" states a
// U+005C (\) counts as "/" for special schemes such as http and https, so "/\host" starts an
// authority (another host), exactly as "//host" does. These are the classic open-redirect bypasses.
describe("the sign-in return path (WHATWG URL parsing against the app's origin)", () => {
  it.each([
    ["//evil.example", "protocol-relative: another host"],
    ["/\\evil.example", "backslash read as a slash (WHATWG URL)"],
    ["\\\\evil.example", "two backslashes"],
    ["/\\/evil.example", "slash, backslash, slash"],
    ["/\t/evil.example", "a tab is removed before parsing (WHATWG URL)"],
    ["/\n/evil.example", "a newline is removed before parsing (WHATWG URL)"],
    ["  //evil.example", "leading spaces are stripped (WHATWG URL)"],
    ["https://evil.example/field", "an absolute URL of another site"],
    ["http://turnstone.example.org/field", "our host but another scheme is another origin"],
    ["javascript:alert(1)", "a script URL has no origin of ours"],
    ["data:text/html,<script>alert(1)</script>", "a data URL"],
    ["/.//evil.example", "a dot segment leaves //evil.example"],
    ["/field/..//evil.example", "a parent segment leaves //evil.example"],
    ["/%2e%2e//evil.example", "percent-encoded dot segments are dot segments too (WHATWG URL)"],
  ])("drops %j (%s)", (from) => {
    expect(safeReturnPath(from, APP)).toBeNull();
  });

  it("keeps an encoded backslash: the parser leaves %5C in the path, so it stays on our site", () => {
    expect(safeReturnPath("/%5Cevil.example", APP)).toBe("/%5Cevil.example");
  });

  it.each([
    ["/field", "/field"],
    ["/field/visit?id=3f1c2a9e-0000-4000-8000-000000000000", "/field/visit?id=3f1c2a9e-0000-4000-8000-000000000000"],
    ["/review?status=pending&page=2#first", "/review?status=pending&page=2#first"],
    ["/network/people?q=a b", "/network/people?q=a%20b"],
    ["https://turnstone.example.org/data", "/data"],
  ])("keeps the same-site path %j as %j", (from, kept) => {
    expect(safeReturnPath(from, APP)).toBe(kept);
  });

  it("falls back to the role's home for nothing, the bare root, or not a string", () => {
    for (const from of [undefined, null, "", "/", 42, ["/field"]]) expect(safeReturnPath(from, APP)).toBeNull();
  });

  it(`bounds the length at ${MAX_RETURN_PATH_LENGTH} characters, before and after parsing`, () => {
    const fits = `/field?q=${"a".repeat(MAX_RETURN_PATH_LENGTH - 9)}`;
    expect(fits).toHaveLength(MAX_RETURN_PATH_LENGTH);
    expect(safeReturnPath(fits, APP)).toBe(fits);
    expect(safeReturnPath(`${fits}a`, APP)).toBeNull();
    // 400 "é" become 2,400 characters once percent-encoded as UTF-8 (%C3%A9).
    expect(safeReturnPath(`/field?q=${"é".repeat(400)}`, APP)).toBeNull();
  });

  it("compares whole origins, so a port or a look-alike host is another site", () => {
    expect(safeReturnPath("https://turnstone.example.org:8443/field", APP)).toBeNull();
    expect(safeReturnPath("https://turnstone.example.org.evil.example/field", APP)).toBeNull();
    expect(safeReturnPath("https://user@evil.example/field", APP)).toBeNull();
  });
});
