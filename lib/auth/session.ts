import "server-only";
import { decode, getToken } from "next-auth/jwt";
import { headers as requestHeaders } from "next/headers";
import { env } from "@/lib/env";

const SESSION_COOKIE = "authjs.session-token";
const SECURE_SESSION_COOKIE = `__Secure-${SESSION_COOKIE}`;

// Decrypting a session cookie costs more than the rest of a small API call. A phone sends the
// same cookie with every sync, so a verified cookie is remembered for a minute (never past its
// own expiry). Only successful decodes are kept; the map is bounded.
const REMEMBER_MS = 60_000;
const MAX_REMEMBERED = 10_000;
const remembered = new Map<string, { userId: string; until: number }>();

function recall(key: string, now: number): string | null {
  const hit = remembered.get(key);
  if (!hit) return null;
  if (hit.until > now) return hit.userId;
  remembered.delete(key);
  return null;
}

function remember(key: string, userId: string, until: number): void {
  if (remembered.size >= MAX_REMEMBERED) remembered.delete(remembered.keys().next().value!);
  remembered.set(key, { userId, until });
}

/** Forgets every remembered cookie (for tests). */
export function forgetVerifiedSessions(): void {
  remembered.clear();
}

/**
 * The user id in an Auth.js session cookie, or null. The cookie is a JWE that Auth.js encrypts
 * with a key derived from the secret and the cookie's name; decrypting it also authenticates it
 * and checks its expiry. Auth.js names the cookie `__Secure-…` when it was set over HTTPS.
 */
export async function userIdFromSessionCookie(headers: Headers, secret: string): Promise<string | null> {
  const cookie = headers.get("cookie");
  if (!cookie || !cookie.includes(SESSION_COOKIE)) return null;
  const cookieName = cookie.includes(SECURE_SESSION_COOKIE) ? SECURE_SESSION_COOKIE : SESSION_COOKIE;
  // getToken's raw mode finds the cookie (joining a chunked one) without decoding it.
  const token = await getToken({ req: { headers }, secret, cookieName, raw: true, logger: silentLogger });
  if (!token) return null;

  const key = `${cookieName}\n${secret}\n${token}`;
  const now = Date.now();
  const known = recall(key, now);
  if (known) return known;

  const payload = await decode({ token, secret, salt: cookieName }).catch(() => null);
  if (!payload || typeof payload.uid !== "string") return null;
  const expiresAt = typeof payload.exp === "number" ? payload.exp * 1000 : now;
  if (expiresAt > now) remember(key, payload.uid, Math.min(expiresAt, now + REMEMBER_MS));
  return payload.uid;
}

// An unreadable cookie (old secret, tampered) is simply "not signed in": nothing to log.
const silentLogger = { error: () => undefined, warn: () => undefined, debug: () => undefined } as unknown as Console;

/**
 * The signed-in user's id for this request. Route handlers pass their request's headers; pages
 * and server actions read them from Next. It only decodes the cookie: the full Auth.js session
 * call would also mint a CSRF token and re-encrypt the session on every request, work a route
 * handler cannot even send back, and which dominated the cost of a field sync.
 */
export async function sessionUserId(headers?: Headers): Promise<string | null> {
  const secret = env().AUTH_SECRET;
  if (!secret) return null; // no secret, no sessions: Auth.js refuses to sign anyone in too
  return userIdFromSessionCookie(headers ?? (await requestHeaders()), secret);
}
