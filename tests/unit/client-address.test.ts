import { describe, expect, it } from "vitest";
import { PEER_ADDRESS_HEADER, UNKNOWN_ADDRESS, addressKey, clientAddress, normaliseAddress } from "@/lib/http/client-address";

const request = (h: Record<string, string>) => new Headers(h);

describe("the client address without a trusted proxy (TRUST_PROXY=false, the default)", () => {
  it("is the peer address serve.mjs wrote, whatever forwarded headers the client sent", () => {
    const headers = request({ [PEER_ADDRESS_HEADER]: "203.0.113.9", "x-forwarded-for": "198.51.100.1", "x-real-ip": "198.51.100.2" });
    expect(clientAddress(headers, false)).toBe("203.0.113.9");
  });

  it("is the shared unknown bucket when there is no peer header (the dev server), never a forwarded header", () => {
    expect(clientAddress(request({ "x-forwarded-for": "198.51.100.1", "x-real-ip": "198.51.100.2" }), false)).toBe(UNKNOWN_ADDRESS);
    expect(clientAddress(request({}), false)).toBe(UNKNOWN_ADDRESS);
  });

  it("ignores a peer header that is not an IP address", () => {
    expect(clientAddress(request({ [PEER_ADDRESS_HEADER]: "not-an-address" }), false)).toBe(UNKNOWN_ADDRESS);
  });
});

// Behind one proxy, X-Forwarded-For is "client-supplied entries, then the address the proxy saw":
// each proxy appends its own peer (MDN, X-Forwarded-For; RFC 7239 section 5.2 for the newer
// Forwarded header, which appends the same way). Only the last entry was written by our proxy.
describe("the client address behind a trusted proxy (TRUST_PROXY=true)", () => {
  it("is the LAST X-Forwarded-For entry: the earlier ones are the client's own words", () => {
    const headers = request({ [PEER_ADDRESS_HEADER]: "10.0.0.2", "x-forwarded-for": "1.1.1.1, 203.0.113.9" });
    expect(clientAddress(headers, true)).toBe("203.0.113.9");
  });

  it("a client that writes X-Forwarded-For itself only adds entries before the proxy's", () => {
    const spoofed = request({ [PEER_ADDRESS_HEADER]: "10.0.0.2", "x-forwarded-for": "192.0.2.77,   203.0.113.9" });
    expect(clientAddress(spoofed, true)).toBe("203.0.113.9");
  });

  it("reads several X-Forwarded-For lines as one list", () => {
    const headers = new Headers();
    headers.append("x-forwarded-for", "192.0.2.77");
    headers.append("x-forwarded-for", "203.0.113.9");
    headers.set(PEER_ADDRESS_HEADER, "10.0.0.2");
    expect(clientAddress(headers, true)).toBe("203.0.113.9");
  });

  it("falls back to the peer address when the header is missing or its last entry is not an address", () => {
    expect(clientAddress(request({ [PEER_ADDRESS_HEADER]: "10.0.0.2" }), true)).toBe("10.0.0.2");
    expect(clientAddress(request({ [PEER_ADDRESS_HEADER]: "10.0.0.2", "x-forwarded-for": "203.0.113.9, unknown" }), true)).toBe("10.0.0.2");
  });

  it("never reads X-Real-IP", () => {
    expect(clientAddress(request({ "x-real-ip": "198.51.100.2" }), true)).toBe(UNKNOWN_ADDRESS);
  });
});

describe("one spelling per address", () => {
  it.each([
    ["::ffff:192.0.2.1", "192.0.2.1"], // IPv4-mapped IPv6, RFC 4291 section 2.5.5.2
    ["::FFFF:192.0.2.1", "192.0.2.1"],
    ["0:0:0:0:0:ffff:192.0.2.1", "192.0.2.1"],
    ["::ffff:c000:201", "192.0.2.1"], // the same address in hex groups
    [" 192.0.2.1 ", "192.0.2.1"],
    ["192.0.2.1:51234", "192.0.2.1"],
    ["[2001:db8::1]:443", "2001:db8::1"],
    ["2001:DB8::1", "2001:db8::1"],
    ["fe80::1%eth0", "fe80::1"],
  ])("%j is %j", (raw, normal) => {
    expect(normaliseAddress(raw)).toBe(normal);
  });

  it.each(["", "unknown", "192.0.2", "192.0.2.256", "2001:db8::1::2", "<script>"])("%j is not an address", (raw) => {
    expect(normaliseAddress(raw)).toBeNull();
  });
});

describe("what per-address limits count by", () => {
  it("an IPv4 address counts alone", () => {
    expect(addressKey("192.0.2.1")).toBe("192.0.2.1");
    expect(addressKey(UNKNOWN_ADDRESS)).toBe(UNKNOWN_ADDRESS);
  });

  it("every address of one IPv6 /64 counts as one (common practice: a subscriber holds at least a /64)", () => {
    const key = addressKey("2001:db8:aa:bb::1");
    expect(key).toBe("2001:db8:aa:bb::/64");
    expect(addressKey("2001:0db8:00aa:00bb:ffff:1:2:3")).toBe(key);
    expect(addressKey("2001:db8:aa:bc::1")).not.toBe(key);
    expect(addressKey("::1")).toBe("0:0:0:0::/64");
    expect(addressKey("64:ff9b::192.0.2.1")).toBe("64:ff9b:0:0::/64");
  });
});
