import { randomUUID } from "node:crypto";
import { and, asc, eq, inArray, notInArray } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { sightings, species, transectAssignments, users, visits } from "@/db/schema";
import type { SightingStatus } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { fieldReference } from "@/lib/queries/field-reference";
import { resetToDemo } from "./support/db";

// "Seen here before" orders the species search on each volunteer's phone. It must not carry
// other volunteers' unchecked records, nor where anyone else found a sensitive species: only
// accepted records, and sensitive species only where this volunteer recorded them.

async function person(email: string): Promise<Actor> {
  const [u] = await db().select().from(users).where(eq(users.email, email));
  return { id: u!.id, roles: u!.roles, name: u!.name, email: u!.email };
}

async function record(volunteerId: string, transectId: string, speciesId: string, status: SightingStatus) {
  const visitId = randomUUID();
  await db().insert(visits).values({ id: visitId, transectId, volunteerId, visitDate: "2026-07-10", startTime: "10:00" });
  await db().insert(sightings).values({ id: randomUUID(), visitId, speciesId, count: 1, status });
}

describe("the field reference's 'seen here before'", () => {
  let me: Actor;
  let other: Actor;
  let transectId: string;
  const picks: Record<"othersPending" | "othersAccepted" | "othersSensitiveAccepted" | "mySensitivePending" | "mySensitiveRejected", string> = {} as never;

  beforeAll(async () => {
    await resetToDemo();
    me = await person("volunteer01@harrowmere.example");
    other = await person("volunteer02@harrowmere.example");
    const [mine] = await db().select().from(transectAssignments).where(eq(transectAssignments.userId, me.id)).orderBy(asc(transectAssignments.transectId)).limit(1);
    transectId = mine!.transectId;
    // The other volunteer walks this transect too (a shared route, or a handover).
    await db().insert(transectAssignments).values({ transectId, userId: other.id });

    // Species nobody has recorded on this transect yet, so each new row decides alone.
    const seenThere = db().select({ id: sightings.speciesId }).from(sightings).innerJoin(visits, eq(visits.id, sightings.visitId)).where(eq(visits.transectId, transectId));
    const fresh = await db().select({ id: species.id, sensitive: species.sensitive }).from(species).where(notInArray(species.id, seenThere)).orderBy(asc(species.sortOrder));
    const plain = fresh.filter((s) => !s.sensitive).map((s) => s.id);
    expect(plain.length).toBeGreaterThanOrEqual(2);
    // Three sensitive species of our own, as the demo has too few unseen on any one transect.
    const sensitive = (
      await db()
        .insert(species)
        .values(["Testia prima", "Testia secunda", "Testia tertia"].map((name) => ({ scientificName: name, vernacularName: `${name} (test)`, taxonGroup: "butterflies", sensitive: true })))
        .returning({ id: species.id })
    ).map((s) => s.id);
    Object.assign(picks, {
      othersPending: plain[0],
      othersAccepted: plain[1],
      othersSensitiveAccepted: sensitive[0],
      mySensitivePending: sensitive[1],
      mySensitiveRejected: sensitive[2],
    });
    await record(other.id, transectId, picks.othersPending, "pending");
    await record(other.id, transectId, picks.othersAccepted, "accepted");
    await record(other.id, transectId, picks.othersSensitiveAccepted, "accepted");
    await record(me.id, transectId, picks.mySensitivePending, "pending");
    await record(me.id, transectId, picks.mySensitiveRejected, "rejected");
  });

  it("leaves out another volunteer's unchecked record and where they found a sensitive species", async () => {
    const seen = (await fieldReference(me)).seenByTransect[transectId] ?? [];
    expect(seen).not.toContain(picks.othersPending);
    expect(seen).not.toContain(picks.othersSensitiveAccepted);
    expect(seen).not.toContain(picks.mySensitiveRejected);
  });

  it("keeps accepted records of anyone, and this volunteer's own sensitive finds", async () => {
    const seen = (await fieldReference(me)).seenByTransect[transectId] ?? [];
    expect(seen).toContain(picks.othersAccepted);
    expect(seen).toContain(picks.mySensitivePending);
    // The other volunteer's phone does not learn where this volunteer found the sensitive species.
    const theirs = (await fieldReference(other)).seenByTransect[transectId] ?? [];
    expect(theirs).not.toContain(picks.mySensitivePending);
    expect(theirs).toContain(picks.othersSensitiveAccepted);
    expect(theirs).toContain(picks.othersAccepted);
  });

  it("lists, on every transect of the demo, only species with an accepted record there or a sensitive one of this volunteer's own", async () => {
    const reference = await fieldReference(me);
    for (const [tId, listed] of Object.entries(reference.seenByTransect)) {
      const rows = await db()
        .select({ speciesId: sightings.speciesId, status: sightings.status, volunteerId: visits.volunteerId, sensitive: species.sensitive })
        .from(sightings)
        .innerJoin(visits, eq(visits.id, sightings.visitId))
        .innerJoin(species, eq(species.id, sightings.speciesId))
        .where(and(eq(visits.transectId, tId), inArray(sightings.speciesId, listed)));
      for (const speciesId of listed) {
        const its = rows.filter((r) => r.speciesId === speciesId);
        const allowed = its.some((r) => (r.sensitive ? r.volunteerId === me.id && r.status !== "rejected" : r.status === "accepted"));
        expect(allowed, `${speciesId} on ${tId}`).toBe(true);
      }
    }
    expect(Object.keys(reference.seenByTransect).length).toBeGreaterThan(0);
  });
});
