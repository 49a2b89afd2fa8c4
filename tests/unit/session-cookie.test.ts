import { encode } from "next-auth/jwt";
import { afterEach, describe, expect, it, vi } from "vitest";
import { forgetVerifiedSessions, userIdFromSessionCookie } from "@/lib/auth/session";

// Tokens are made with Auth.js's own `encode` (the library that signs people in), so this checks
// that our lighter reader accepts exactly what Auth.js writes and nothing else.
const secret = "a-test-secret-that-is-long-enough-0123456789";
const uid = "4f6c2b1e-9a7d-4c3e-8b21-0d5e6f7a8b9c";

async function tokenFor(options: { salt: string; secret?: string; maxAge?: number; uid?: unknown }) {
  return encode({ token: { uid: options.uid ?? uid, role: "volunteer", sub: "x" }, secret: options.secret ?? secret, salt: options.salt, maxAge: options.maxAge });
}
const withCookie = (cookie: string) => new Headers({ cookie });

describe("reading the session cookie", () => {
  afterEach(() => {
    vi.useRealTimers();
    forgetVerifiedSessions();
  });

  it("reads the user id from a cookie Auth.js wrote, over HTTP and over HTTPS", async () => {
    const plain = await tokenFor({ salt: "authjs.session-token" });
    expect(await userIdFromSessionCookie(withCookie(`theme=dark; authjs.session-token=${plain}`), secret)).toBe(uid);
    const secure = await tokenFor({ salt: "__Secure-authjs.session-token" });
    expect(await userIdFromSessionCookie(withCookie(`__Secure-authjs.session-token=${secure}`), secret)).toBe(uid);
  });

  it("refuses a cookie made with another secret, a tampered one, an expired one and one under the wrong name", async () => {
    const other = await tokenFor({ salt: "authjs.session-token", secret: "another-secret-that-is-long-enough-98765" });
    expect(await userIdFromSessionCookie(withCookie(`authjs.session-token=${other}`), secret)).toBeNull();

    const good = await tokenFor({ salt: "authjs.session-token" });
    const flipped = good.slice(0, -6) + (good.at(-6) === "A" ? "B" : "A") + good.slice(-5);
    expect(await userIdFromSessionCookie(withCookie(`authjs.session-token=${flipped}`), secret)).toBeNull();

    const expired = await tokenFor({ salt: "authjs.session-token", maxAge: -60 });
    expect(await userIdFromSessionCookie(withCookie(`authjs.session-token=${expired}`), secret)).toBeNull();

    // Salted for the HTTPS name but presented under the plain one: the key differs, so it fails.
    const secureSalted = await tokenFor({ salt: "__Secure-authjs.session-token" });
    expect(await userIdFromSessionCookie(withCookie(`authjs.session-token=${secureSalted}`), secret)).toBeNull();
  });

  it("is null without a cookie, with unrelated cookies, and for a token without a user id", async () => {
    expect(await userIdFromSessionCookie(new Headers(), secret)).toBeNull();
    expect(await userIdFromSessionCookie(withCookie("theme=dark"), secret)).toBeNull();
    const noUid = await encode({ token: { role: "volunteer" }, secret, salt: "authjs.session-token" });
    expect(await userIdFromSessionCookie(withCookie(`authjs.session-token=${noUid}`), secret)).toBeNull();
  });

  it("stops honouring a remembered cookie once the cookie itself has expired", async () => {
    vi.useFakeTimers({ toFake: ["Date"] });
    vi.setSystemTime(new Date("2026-06-01T08:00:00Z"));
    const shortLived = await tokenFor({ salt: "authjs.session-token", maxAge: 30 });
    const headers = withCookie(`authjs.session-token=${shortLived}`);
    expect(await userIdFromSessionCookie(headers, secret)).toBe(uid);
    vi.setSystemTime(new Date("2026-06-01T08:00:20Z"));
    expect(await userIdFromSessionCookie(headers, secret)).toBe(uid); // still valid, from memory
    // Past expiry and Auth.js's 15 s clock tolerance: neither the memory nor the decoder accepts it.
    vi.setSystemTime(new Date("2026-06-01T08:00:50Z"));
    expect(await userIdFromSessionCookie(headers, secret)).toBeNull();
  });

  it("does not let a remembered cookie stand in for a different secret", async () => {
    const token = await tokenFor({ salt: "authjs.session-token" });
    const headers = withCookie(`authjs.session-token=${token}`);
    expect(await userIdFromSessionCookie(headers, secret)).toBe(uid);
    expect(await userIdFromSessionCookie(headers, "a-rotated-secret-that-is-long-enough-000000")).toBeNull();
  });
});
