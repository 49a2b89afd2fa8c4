import NextAuth from "next-auth";
import { NextResponse, type NextRequest } from "next/server";
import { authConfig } from "./auth.config";
import { env } from "@/lib/env";
import { contentSecurityPolicy, newNonce, STRICT_TRANSPORT_SECURITY } from "@/lib/http/security-headers";

const { auth } = NextAuth(authConfig);

/** Over HTTPS: the public address says so, or this request came that way (as Next reads it). */
function servedOverHttps(request: NextRequest): boolean {
  return env().APP_URL.startsWith("https://") || request.nextUrl.protocol === "https:";
}

/**
 * Lets the page render with a fresh script nonce. Next reads the nonce from the request's
 * Content-Security-Policy header and puts it on its own scripts (Next's CSP guide), so the policy
 * goes on the request as well as on the answer.
 */
function renderWithPolicy(request: NextRequest): NextResponse {
  const e = env();
  const https = servedOverHttps(request);
  const policy = contentSecurityPolicy({
    nonce: newNonce(),
    https,
    development: process.env.NODE_ENV === "development",
    objectStore: { endpoint: e.S3_ENDPOINT, bucket: e.S3_BUCKET, pathStyle: e.S3_FORCE_PATH_STYLE },
    mapTiles: e.MAP_TILE_URL,
  });
  const headers = new Headers(request.headers);
  headers.set("content-security-policy", policy);
  const response = NextResponse.next({ request: { headers } });
  response.headers.set("content-security-policy", policy);
  if (https) response.headers.set("strict-transport-security", STRICT_TRANSPORT_SECURITY);
  return response;
}

/** A stranger goes to sign-in with the page asked for as `from` (lib/auth/return-path.ts keeps it only on this site). */
function toSignIn(request: NextRequest): NextResponse {
  const signIn = request.nextUrl.clone();
  signIn.pathname = authConfig.pages.signIn;
  signIn.search = "";
  signIn.searchParams.set("from", `${request.nextUrl.pathname}${request.nextUrl.search}`);
  return NextResponse.redirect(signIn);
}

// Pages only: turns strangers away early (every page checks again on the server) and sets the
// page's security headers. Auth.js answers itself when authorized() returns a Response, and
// otherwise calls this without passing on its yes or no, so authorized() is asked again here.
export const proxy = auth(async (request) => {
  const allowed = await authConfig.callbacks.authorized({ auth: request.auth, request });
  return allowed ? renderWithPolicy(request) : toSignIn(request);
});

export const config = {
  // Pages only. Route handlers check the session themselves (lib/http/route.ts), so the proxy's
  // cookie decoding and refresh would only add work to every API call, and Next would copy each
  // request body for it; static files need none. Their headers come from next.config.ts.
  matcher: ["/((?!api/|_next/static|_next/image|favicon.ico|sw.js|swe-worker|manifest.webmanifest|icons/|fonts/).*)"],
};
