import { eq } from "drizzle-orm";
import { beforeEach, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { seasons, users } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { fieldReference } from "@/lib/queries/field-reference";
import { resetToDemo } from "./support/db";

// The phone offers walk dates only inside the seasons its reference data names: those taking
// walks now (open, or closed and in the grace period), never a frozen or planned one.

async function volunteer(): Promise<Actor> {
  const [u] = await db().select().from(users).where(eq(users.email, "volunteer01@harrowmere.example"));
  return { id: u!.id, roles: u!.roles, name: u!.name, email: u!.email };
}

describe("the field reference's seasons", () => {
  beforeEach(async () => {
    await resetToDemo();
  });

  it("lists the open season, and a closed one only while in its grace period", async () => {
    const actor = await volunteer();
    const [open] = await db().select().from(seasons).where(eq(seasons.status, "open"));
    const [closed] = await db().select().from(seasons).where(eq(seasons.status, "closed"));
    expect((await fieldReference(actor)).seasons).toEqual([{ name: open!.name, startsOn: open!.startsOn, endsOn: open!.endsOn, phase: "open" }]);

    // Closed an hour ago: inside the grace period, so late walks are still offered.
    await db().update(seasons).set({ closedAt: new Date(Date.now() - 3_600_000) }).where(eq(seasons.id, closed!.id));
    expect((await fieldReference(actor)).seasons).toEqual([
      { name: closed!.name, startsOn: closed!.startsOn, endsOn: closed!.endsOn, phase: "grace" },
      { name: open!.name, startsOn: open!.startsOn, endsOn: open!.endsOn, phase: "open" },
    ]);
  });
});
