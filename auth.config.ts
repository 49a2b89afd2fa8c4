import type { NextAuthConfig } from "next-auth";

/** Pages (and their sub-paths) open to strangers. */
export const publicPaths = ["/sign-in", "/safety", "/invitation"];

// Database-free part of the configuration: the proxy runs it on every request.
// The proxy only turns strangers away early; every page, route and action checks again on the server.
// The cookie carries only the person's id: roles are read from the database on every request
// (lib/auth/guard.ts), so a role change takes effect at once and a stale cookie grants nothing.
export const authConfig = {
  trustHost: true,
  pages: { signIn: "/sign-in" },
  session: { strategy: "jwt", maxAge: 60 * 60 * 24 * 30 },
  providers: [],
  callbacks: {
    jwt({ token, user }) {
      if (user?.id) token.uid = user.id;
      return token;
    },
    session({ session, token }) {
      if (session.user && typeof token.uid === "string") session.user.id = token.uid;
      return session;
    },
    // May answer with a Response (proxy.ts passes one on); today it only says yes or no.
    authorized({ auth, request }): boolean | Response {
      const { pathname } = request.nextUrl;
      if (pathname.startsWith("/api/")) return true; // route handlers answer 401/403 as JSON
      if (publicPaths.some((p) => pathname === p || pathname.startsWith(`${p}/`))) return true;
      // Signed in: each page checks the person's roles itself (403 for another area's page).
      return Boolean(auth?.user?.id);
    },
  },
} satisfies NextAuthConfig;
