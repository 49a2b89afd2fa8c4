import type { NextAuthConfig } from "next-auth";
import { isRole, roleHome, rolesForPath } from "@/lib/auth/roles";

/** Pages (and their sub-paths) open to strangers. */
export const publicPaths = ["/sign-in", "/safety", "/invitation"];

// Database-free part of the configuration: the proxy runs it on every request.
// The proxy only turns strangers away early; every page, route and action checks again on the server.
export const authConfig = {
  trustHost: true,
  pages: { signIn: "/sign-in" },
  session: { strategy: "jwt", maxAge: 60 * 60 * 24 * 30 },
  providers: [],
  callbacks: {
    jwt({ token, user }) {
      if (user && "role" in user && isRole(user.role)) {
        token.role = user.role;
        token.uid = user.id;
      }
      return token;
    },
    session({ session, token }) {
      if (session.user && isRole(token.role) && typeof token.uid === "string") {
        session.user.id = token.uid;
        session.user.role = token.role;
      }
      return session;
    },
    authorized({ auth, request }) {
      const { pathname } = request.nextUrl;
      if (pathname.startsWith("/api/")) return true; // route handlers answer 401/403 as JSON
      if (publicPaths.some((p) => pathname === p || pathname.startsWith(`${p}/`))) return true;
      const role = auth?.user?.role;
      if (!role) return false;
      const allowed = rolesForPath(pathname);
      if (allowed && !allowed.includes(role)) return true; // the page itself renders 403
      if (pathname === "/") return Response.redirect(new URL(roleHome[role], request.nextUrl));
      return true;
    },
  },
} satisfies NextAuthConfig;
