import NextAuth, { CredentialsSignin } from "next-auth";
import Credentials from "next-auth/providers/credentials";
import { eq, sql } from "drizzle-orm";
import { z } from "zod";
import { authConfig } from "./auth.config";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { decoyHash, verifyPassword } from "@/lib/auth/password";
import { finishSignInAttempt, startSignInAttempt } from "@/lib/auth/rate-limit";
import { env } from "@/lib/env";
import { clientAddress } from "@/lib/http/client-address";

/** Thrown by authorize when the sign-in limit says wait; the sign-in action shows how long. */
export class TooManyAttempts extends CredentialsSignin {
  code = "too_many_attempts";
  constructor(readonly retryAfterMs: number) {
    super();
  }
}

const credentialsSchema = z.object({
  email: z.email().max(320).transform((v) => v.trim().toLowerCase()),
  password: z.string().min(1).max(200),
});

export const { handlers, auth, signIn, signOut } = NextAuth({
  ...authConfig,
  secret: env().AUTH_SECRET,
  providers: [
    Credentials({
      credentials: { email: { type: "email" }, password: { type: "password" } },
      async authorize(raw, request) {
        const parsed = credentialsSchema.safeParse(raw);
        if (!parsed.success) return null;
        const { email, password } = parsed.data;
        const attempt = await startSignInAttempt(email, clientAddress(request.headers));
        if (!attempt.allowed) throw new TooManyAttempts(attempt.retryAfterMs);

        const [user] = await db()
          .select()
          .from(users)
          .where(eq(sql`lower(${users.email})`, email))
          .limit(1);
        // Always run one bcrypt comparison so an unknown e-mail takes as long as a wrong password.
        const ok = await verifyPassword(password, user?.passwordHash ?? decoyHash);
        const accepted = Boolean(user && user.active && user.passwordHash && ok);
        await finishSignInAttempt(attempt.attemptId, accepted);
        if (!accepted || !user) return null;

        await db().update(users).set({ lastSignInAt: new Date() }).where(eq(users.id, user.id));
        return { id: user.id, email: user.email, name: user.name };
      },
    }),
  ],
});
