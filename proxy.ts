import NextAuth from "next-auth";
import { authConfig } from "./auth.config";

const { auth } = NextAuth(authConfig);
export const proxy = auth;

export const config = {
  // Pages only. Route handlers check the session themselves (lib/http/route.ts), so the proxy's
  // cookie decoding and refresh would only add work to every API call; static files need none.
  matcher: ["/((?!api/|_next/static|_next/image|favicon.ico|sw.js|swe-worker|manifest.webmanifest|icons/|fonts/).*)"],
};
