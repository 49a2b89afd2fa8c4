import NextAuth from "next-auth";
import { authConfig } from "./auth.config";

const { auth } = NextAuth(authConfig);
export const proxy = auth;

export const config = {
  // Static files, the service worker and icons are served without a session.
  matcher: ["/((?!_next/static|_next/image|favicon.ico|sw.js|swe-worker|manifest.webmanifest|icons/|fonts/).*)"],
};
