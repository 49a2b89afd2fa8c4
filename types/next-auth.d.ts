import type { DefaultSession } from "next-auth";

// The session cookie names the person only; roles are read from the database (lib/auth/guard.ts).
declare module "next-auth" {
  interface Session {
    user: { id: string } & DefaultSession["user"];
  }
}

declare module "@auth/core/jwt" {
  interface JWT {
    uid?: string;
  }
}
