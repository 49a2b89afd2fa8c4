import type { DefaultSession } from "next-auth";
import type { Role } from "@/db/schema/people";

declare module "next-auth" {
  interface Session {
    user: { id: string; role: Role } & DefaultSession["user"];
  }
  interface User {
    role?: Role;
  }
}

declare module "@auth/core/jwt" {
  interface JWT {
    role?: Role;
    uid?: string;
  }
}
