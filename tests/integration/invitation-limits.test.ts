import { randomBytes } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { invitationTokenFailures, invitations, users } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { INVITATION_POLICY, limitTokenCheck } from "@/lib/auth/invitation-limit";
import { hashPassword } from "@/lib/auth/password";
import { acceptInvitation, findOpenInvitation, holdsRole, invitePerson } from "@/lib/queries/people";
import { resetToDemo } from "./support/db";

// Watch bcrypt without changing it: the check must run before any password is hashed.
vi.mock("@/lib/auth/password", async (importOriginal) => {
  const real = await importOriginal<typeof import("@/lib/auth/password")>();
  return { ...real, hashPassword: vi.fn(real.hashPassword) };
});

const MINUTE = 60_000;
const GUESSER = "198.51.100.23";
const INVITEE = "203.0.113.40";
const guess = () => randomBytes(32).toString("base64url");

async function organiser(): Promise<Actor> {
  const [u] = await db().select().from(users).where(holdsRole("organiser")).limit(1);
  return { id: u!.id, roles: u!.roles, name: u!.name, email: u!.email };
}

describe("accepting an invitation: the token first, and a limit per address", () => {
  beforeAll(async () => {
    await resetToDemo();
  });
  beforeEach(async () => {
    await db().delete(invitationTokenFailures);
    await db().delete(invitations);
    await db().delete(users).where(eq(users.email, "ria@example.org"));
    vi.mocked(hashPassword).mockClear();
  });

  it("a token that names no open invitation is refused before any password is hashed", async () => {
    await expect(acceptInvitation(guess(), "a-long-password", GUESSER)).rejects.toMatchObject({ status: 404 });
    expect(hashPassword).not.toHaveBeenCalled();
  });

  it(`after ${INVITATION_POLICY.maxFailures} unknown tokens from one address, it waits, even with a real token; other addresses do not`, async () => {
    const { token } = await invitePerson(await organiser(), { name: "Ria Penn", email: "ria@example.org", roles: ["volunteer"] });
    for (let i = 0; i < INVITATION_POLICY.maxFailures; i++) expect(await findOpenInvitation(guess(), GUESSER)).toBeNull();
    await expect(acceptInvitation(token, "a-long-password", GUESSER)).rejects.toMatchObject({ status: 429, message: expect.stringMatching(/Try again in 15 minutes/) });
    expect(hashPassword).not.toHaveBeenCalled();
    expect(await db().select().from(users).where(eq(users.email, "ria@example.org"))).toHaveLength(0);

    await acceptInvitation(token, "a-long-password", INVITEE);
    expect(await db().select().from(users).where(eq(users.email, "ria@example.org"))).toHaveLength(1);
  });

  it("the invitation page's lookup and the acceptance share one budget", async () => {
    for (let i = 0; i < INVITATION_POLICY.maxFailures - 1; i++) await findOpenInvitation(guess(), GUESSER);
    await expect(acceptInvitation(guess(), "a-long-password", GUESSER)).rejects.toMatchObject({ status: 404 });
    await expect(findOpenInvitation(guess(), GUESSER)).rejects.toMatchObject({ status: 429 });
  });

  it("a token that works costs nothing", async () => {
    const { token } = await invitePerson(await organiser(), { name: "Ria Penn", email: "ria@example.org", roles: ["volunteer"] });
    for (let i = 0; i < 3 * INVITATION_POLICY.maxFailures; i++) expect(await findOpenInvitation(token, INVITEE)).not.toBeNull();
    await acceptInvitation(token, "a-long-password", INVITEE);
    const [left] = await db().execute<{ n: number }>(sql`select count(*)::int as n from invitation_token_failures`);
    expect(left?.n).toBe(0);
  });

  it("parallel guesses cannot slip past the count", async () => {
    const outcomes = await Promise.allSettled(Array.from({ length: 2 * INVITATION_POLICY.maxFailures }, () => findOpenInvitation(guess(), GUESSER)));
    expect(outcomes.filter((o) => o.status === "fulfilled")).toHaveLength(INVITATION_POLICY.maxFailures);
    expect(outcomes.filter((o) => o.status === "rejected").every((o) => (o as PromiseRejectedResult).reason.status === 429)).toBe(true);
  });

  it("the wait ends when the oldest counted failure is 15 minutes old", async () => {
    const t0 = new Date();
    const miss = async () => null;
    for (let i = 0; i < INVITATION_POLICY.maxFailures; i++) await limitTokenCheck(GUESSER, miss, new Date(t0.getTime() + i * MINUTE));
    const last = new Date(t0.getTime() + (INVITATION_POLICY.maxFailures - 1) * MINUTE);
    await expect(limitTokenCheck(GUESSER, miss, last)).rejects.toMatchObject({ status: 429, message: expect.stringMatching(/Try again in 6 minutes/) });
    await expect(limitTokenCheck(GUESSER, miss, new Date(t0.getTime() + 15 * MINUTE - 1))).rejects.toMatchObject({ status: 429 });
    expect(await limitTokenCheck(GUESSER, miss, new Date(t0.getTime() + 15 * MINUTE))).toBeNull();
  });
});
