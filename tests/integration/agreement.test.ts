import { eq } from "drizzle-orm";
import { beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { agreementAcceptances, networkChanges, recorderAgreements, users } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { acceptAgreement, needsAgreement, publishAgreement, recorderCredits, setNewsletterPreference } from "@/lib/queries/agreements";
import { resetToDemo } from "./support/db";
import { call, demo, userId } from "./transects-helpers";

const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/session", () => ({ sessionUserId: async () => session.userId }));

const agreementRoute = await import("@/app/(network)/api/network/agreement/route");
const { acceptAgreementAction } = await import("@/app/agreement/actions");

async function actorFor(email: string): Promise<Actor> {
  const [u] = await db().select().from(users).where(eq(users.email, email));
  return { id: u!.id, roles: u!.roles, name: u!.name, email: u!.email };
}
const TEXT = "The network keeps your records to measure change on its transects, and shares checked records with partner scientists.";
const standing = async (id: string) => (await db().select({ publishName: users.publishName, newsletter: users.newsletter }).from(users).where(eq(users.id, id)))[0]!;

describe("the recorder agreement", () => {
  beforeEach(async () => {
    await resetToDemo();
    session.userId = null;
  });

  it("an organiser publishes numbered versions through the route, each logged; the same text again is refused", async () => {
    session.userId = await userId(demo.organiser);
    expect((await call(agreementRoute.POST, { body: { body: TEXT, licence: "CC-BY-4.0" } })).status).toBe(201);
    const second = await call(agreementRoute.POST, { body: { body: `${TEXT} Version two.`, licence: "CC0-1.0" } });
    expect(second).toMatchObject({ status: 201, json: { version: 2 } });
    const same = await call(agreementRoute.POST, { body: { body: `${TEXT} Version two.`, licence: "CC0-1.0" } });
    expect(same.status).toBe(400);
    const bad = await call(agreementRoute.POST, { body: { body: "short", licence: "GPL-3.0" } });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.json.error.fields).sort()).toEqual(["body", "licence"]);
    const list = await call(agreementRoute.GET);
    expect(list.json.versions.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    const log = await db().select().from(networkChanges).where(eq(networkChanges.entity, "agreement"));
    expect(log.map((l) => l.entityId).sort()).toEqual(["1", "2"]);
    expect(log.find((l) => l.entityId === "2")!.before).toMatchObject({ version: 1, licence: "CC-BY-4.0" });
  });

  it("only organisers reach the organiser's agreement routes", async () => {
    for (const who of [demo.volunteer, demo.partner, demo.coordinator]) {
      session.userId = await userId(who);
      expect((await call(agreementRoute.GET)).status, who).toBe(403);
      expect((await call(agreementRoute.POST, { body: { body: TEXT, licence: "CC0-1.0" } })).status, who).toBe(403);
    }
    expect(await db().select().from(recorderAgreements)).toHaveLength(0);
  });

  it("a volunteer accepts at first sign-in and again when it changes; each acceptance is stored with its answers", async () => {
    const organiser = await actorFor(demo.organiser);
    const volunteer = await actorFor(demo.volunteer);
    expect(await needsAgreement(volunteer)).toBe(false); // nothing written yet
    await publishAgreement(organiser, { body: TEXT, licence: "CC-BY-4.0" });
    expect(await needsAgreement(volunteer)).toBe(true);
    expect(await needsAgreement(organiser)).toBe(false); // not a recorder

    session.userId = volunteer.id;
    const accepted = await acceptAgreementAction({ version: 1, publishName: true, newsletter: false });
    expect(accepted.ok).toBe(true);
    expect(await needsAgreement(volunteer)).toBe(false);
    expect(await standing(volunteer.id)).toEqual({ publishName: true, newsletter: false });

    await publishAgreement(organiser, { body: `${TEXT} Now with photos.`, licence: "CC-BY-NC-4.0" });
    expect(await needsAgreement(volunteer)).toBe(true);
    // The page they read showed version 1: refused, nothing stored.
    await expect(acceptAgreement(volunteer, { version: 1, publishName: false, newsletter: true })).rejects.toMatchObject({ status: 409 });
    const unanswered = await acceptAgreementAction({ version: 2, publishName: false });
    expect(unanswered).toMatchObject({ ok: false, fieldErrors: { newsletter: [expect.any(String)] } });
    await acceptAgreement(volunteer, { version: 2, publishName: false, newsletter: true });
    expect(await needsAgreement(volunteer)).toBe(false);
    expect(await standing(volunteer.id)).toEqual({ publishName: false, newsletter: true });

    const rows = await db().select().from(agreementAcceptances).where(eq(agreementAcceptances.userId, volunteer.id)).orderBy(agreementAcceptances.acceptedAt);
    expect(rows.map((r) => [r.version, r.publishName, r.newsletter])).toEqual([
      [1, true, false],
      [2, false, true],
    ]);
  });

  it("only volunteers accept it; partners and checkers are refused", async () => {
    await publishAgreement(await actorFor(demo.organiser), { body: TEXT, licence: "CC0-1.0" });
    for (const who of [demo.partner, demo.coordinator]) {
      session.userId = await userId(who);
      expect(await acceptAgreementAction({ version: 1, publishName: true, newsletter: true })).toMatchObject({ ok: false });
    }
    expect(await db().select().from(agreementAcceptances)).toHaveLength(0);
  });

  it("the newsletter choice: the agreement's answer and the unsubscribe set the same preference, the latest wins", async () => {
    const volunteer = await actorFor(demo.volunteer);
    await publishAgreement(await actorFor(demo.organiser), { body: TEXT, licence: "CC0-1.0" });
    await acceptAgreement(volunteer, { version: 1, publishName: false, newsletter: true });
    await setNewsletterPreference(db(), volunteer.id, false); // the one-click unsubscribe
    expect((await standing(volunteer.id)).newsletter).toBe(false);
    await acceptAgreement(volunteer, { version: 1, publishName: false, newsletter: true }); // changed their mind on the agreement page
    expect((await standing(volunteer.id)).newsletter).toBe(true);
  });

  it("published data names a recorder only when they said so, else by their stable pseudonym", async () => {
    const a = await actorFor(demo.volunteer);
    const b = await actorFor("volunteer02@harrowmere.example");
    await publishAgreement(await actorFor(demo.organiser), { body: TEXT, licence: "CC0-1.0" });
    await acceptAgreement(a, { version: 1, publishName: true, newsletter: false });
    const credits = await recorderCredits([a.id, b.id]);
    const [bRow] = await db().select({ pseudonym: users.pseudonym }).from(users).where(eq(users.id, b.id));
    expect(credits.get(a.id)).toBe(a.name);
    expect(credits.get(b.id)).toBe(bRow!.pseudonym);
    expect(bRow!.pseudonym).toMatch(/^Recorder [0-9A-F]{8}$/);
    // Stable: the same after another acceptance.
    await acceptAgreement(b, { version: 1, publishName: false, newsletter: false });
    expect((await recorderCredits([b.id])).get(b.id)).toBe(bRow!.pseudonym);
  });
});
