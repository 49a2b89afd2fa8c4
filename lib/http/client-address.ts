import { isIP } from "node:net";
import { env } from "@/lib/env";

/** Written by scripts/serve.mjs on every request from the TCP peer's address, replacing any sent. */
export const PEER_ADDRESS_HEADER = "x-turnstone-peer-address";

/** No address known (the dev server has no peer header): one shared bucket, which locks nobody out. */
export const UNKNOWN_ADDRESS = "unknown";

/**
 * The client's address, for limits and logs. Without a trusted proxy only the peer address counts:
 * X-Forwarded-For and X-Real-IP are whatever the client chose to send. Behind one trusted proxy
 * (TRUST_PROXY=true) it is the LAST X-Forwarded-For entry, the one that proxy appended from its own
 * peer; every entry before it was already in the request the client sent, so it proves nothing.
 */
export function clientAddress(headers: Headers, trustProxy: boolean = env().TRUST_PROXY): string {
  const peer = normaliseAddress(headers.get(PEER_ADDRESS_HEADER));
  if (trustProxy) {
    // Several X-Forwarded-For lines arrive joined with ", " (the Fetch Headers get() rule).
    const entries = (headers.get("x-forwarded-for") ?? "").split(",").map((e) => e.trim()).filter(Boolean);
    const appended = normaliseAddress(entries.at(-1) ?? null);
    if (appended) return appended;
  }
  return peer ?? UNKNOWN_ADDRESS;
}

/** A bare IP address in one spelling (IPv4-mapped IPv6 as IPv4, lower case, no port), or null. */
export function normaliseAddress(raw: string | null): string | null {
  if (!raw) return null;
  let a = raw.trim().toLowerCase();
  const bracketed = /^\[([^\]]+)\](?::\d+)?$/.exec(a); // [2001:db8::1]:443
  if (bracketed) a = bracketed[1]!;
  else if (/^\d{1,3}(\.\d{1,3}){3}:\d+$/.test(a)) a = a.slice(0, a.lastIndexOf(":")); // 192.0.2.1:443
  a = a.replace(/%.*$/, ""); // an IPv6 zone id names the server's interface, not the client
  const version = isIP(a);
  if (version === 4) return a;
  if (version !== 6) return null;
  // IPv4-mapped IPv6 (::ffff:a.b.c.d, RFC 4291 section 2.5.5.2): how a dual-stack socket reports
  // an IPv4 peer; the same client must count the same whichever way it arrived.
  const groups = ipv6Groups(a);
  if (groups.slice(0, 5).every((g) => g === "0") && groups[5] === "ffff") {
    const [hi, lo] = [parseInt(groups[6]!, 16), parseInt(groups[7]!, 16)];
    return [hi >> 8, hi & 255, lo >> 8, lo & 255].join(".");
  }
  return a;
}

/**
 * What per-address limits count by: an IPv4 address, or the /64 an IPv6 address lies in. One
 * subscriber is usually given at least a /64 and can use any address in it (common practice), so
 * counting single IPv6 addresses would give one machine 2^64 fresh budgets.
 */
export function addressKey(address: string): string {
  if (isIP(address) !== 6) return address;
  return `${ipv6Groups(address).slice(0, 4).join(":")}::/64`;
}

/** The eight 16-bit groups of a valid IPv6 address, in hex without leading zeros. */
function ipv6Groups(address: string): string[] {
  let text = address;
  const v4 = /(\d{1,3})\.(\d{1,3})\.(\d{1,3})\.(\d{1,3})$/.exec(text);
  if (v4) {
    const [p, q, r, s] = v4.slice(1).map(Number) as [number, number, number, number];
    text = `${text.slice(0, v4.index)}${((p << 8) | q).toString(16)}:${((r << 8) | s).toString(16)}`;
  }
  const [head = "", tail] = text.split("::");
  const left = head ? head.split(":") : [];
  const right = tail ? tail.split(":") : [];
  const groups = tail === undefined ? left : [...left, ...Array<string>(8 - left.length - right.length).fill("0"), ...right];
  return groups.map((g) => parseInt(g, 16).toString(16));
}
