import { eq, ne } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { transectAssignments, users } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { assertAssigned, assignedTransects } from "@/lib/queries/field";
import { resetToDemo } from "./support/db";

describe("a volunteer's own transects", () => {
  let actor: Actor;
  let mine: string[];
  let theirs: string;

  beforeAll(async () => {
    await resetToDemo();
    const [u] = await db().select().from(users).where(eq(users.email, "volunteer01@harrowmere.example"));
    actor = { id: u!.id, roles: u!.roles, name: u!.name, email: u!.email };
    mine = (await db().select().from(transectAssignments).where(eq(transectAssignments.userId, actor.id))).map((a) => a.transectId);
    const [other] = await db().select().from(transectAssignments).where(ne(transectAssignments.userId, actor.id)).limit(1);
    theirs = other!.transectId;
  });

  it("lists exactly the assigned transects, with last visit and this season's count", async () => {
    const { season, transects } = await assignedTransects(actor);
    expect(transects.map((t) => t.id).sort()).toEqual([...mine].sort());
    expect(season?.name).toBe("2026 season");
    for (const t of transects) {
      expect(t.lastVisit).toMatch(/^2026-/);
      expect(t.visitsThisSeason).toBeGreaterThan(0);
    }
  });

  it("allows the volunteer's own transects and refuses anyone else's with 403", async () => {
    await expect(assertAssigned(actor, mine)).resolves.toBeUndefined();
    await expect(assertAssigned(actor, [mine[0]!, theirs])).rejects.toMatchObject({ status: 403 });
  });
});
