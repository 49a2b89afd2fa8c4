import { eq, sql } from "drizzle-orm";
import { beforeEach, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { emailOutbox, invitations, users } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { verifyPassword } from "@/lib/auth/password";
import { acceptInvitation, invitePerson, updatePerson } from "@/lib/queries/people";
import { resetToDemo } from "./support/db";

async function organiser(): Promise<Actor> {
  const [u] = await db().select().from(users).where(eq(users.role, "organiser")).limit(1);
  return { id: u!.id, role: u!.role, name: u!.name, email: u!.email };
}

describe("inviting people and setting roles", () => {
  beforeEach(async () => {
    await resetToDemo();
  });

  it("an invitation and its e-mail are written together; the token is stored only as a hash", async () => {
    const actor = await organiser();
    const { token } = await invitePerson(actor, { name: "Nia Holt", email: "Nia.Holt@Example.org", role: "coordinator" });
    const [invite] = await db().select().from(invitations);
    expect(invite!.email).toBe("nia.holt@example.org");
    expect(invite!.tokenHash).not.toContain(token);
    const [mail] = await db().select().from(emailOutbox).where(eq(emailOutbox.toAddress, "nia.holt@example.org"));
    expect(mail!.textBody).toContain(`/invitation/${token}`);
    expect(mail!.status).toBe("queued");
  });

  it("refuses to invite an e-mail already in the network, in any letter case, and writes nothing", async () => {
    const actor = await organiser();
    await expect(invitePerson(actor, { name: "Dup", email: "VOLUNTEER01@harrowmere.example", role: "volunteer" })).rejects.toMatchObject({ status: 409 });
    expect(await db().select().from(emailOutbox)).toHaveLength(0);
    expect(await db().select().from(invitations)).toHaveLength(0);
  });

  it("accepting creates the account with the invited role, once only", async () => {
    const actor = await organiser();
    const { token } = await invitePerson(actor, { name: "Nia Holt", email: "nia@example.org", role: "partner" });
    await acceptInvitation(token, "a-long-password", "203.0.113.5");
    const [u] = await db().select().from(users).where(eq(sql`lower(${users.email})`, "nia@example.org"));
    expect(u!.role).toBe("partner");
    expect(await verifyPassword("a-long-password", u!.passwordHash!)).toBe(true);
    await expect(acceptInvitation(token, "another-password", "203.0.113.5")).rejects.toMatchObject({ status: 404 });
  });

  it("an organiser changes a role; the last organiser cannot step down", async () => {
    const actor = await organiser();
    const [vol] = await db().select().from(users).where(eq(users.role, "volunteer")).limit(1);
    await updatePerson(actor, { userId: vol!.id, role: "coordinator", active: true });
    const [after] = await db().select().from(users).where(eq(users.id, vol!.id));
    expect(after!.role).toBe("coordinator");
    await expect(updatePerson(actor, { userId: actor.id, role: "volunteer", active: true })).rejects.toMatchObject({ status: 400 });
    await expect(updatePerson(actor, { userId: actor.id, role: "organiser", active: false })).rejects.toMatchObject({ status: 400 });
  });
});
