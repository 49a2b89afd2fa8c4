import "fake-indexeddb/auto";
import Dexie from "dexie";
import { beforeEach, describe, expect, it } from "vitest";
import { hasWorkToSend } from "@/lib/offline/pending-work";
import { PhoneStore, phoneStore, setFieldUser, setPhoneStore } from "@/lib/offline/phone-store";
import { runOutbox, unsentOnPhone } from "@/lib/offline/outbox";
import { reportWeatherMiss, UNDO_TOO_LATE, weatherReportFor, withdrawWeatherMiss } from "@/lib/offline/weather";
import { SYNC_PROTOCOL_VERSION } from "@/lib/sync/protocol";
import { fakeServer } from "./fake-sync-server";

const userId = "3d5e7f90-1a2b-4c3d-8e4f-5a6b7c8d9e0f";
const otherUser = "9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d";
const transectId = "6f1c1f7e-2b7a-4c1e-9a55-5d2f0c7b9a10";
const otherTransect = "7a2d2e8f-3c8b-4d2f-8b66-6e3f1d8c0b21";

describe("weather reports on the phone", () => {
  beforeEach(async () => {
    const db = new PhoneStore(`test-${crypto.randomUUID()}`);
    setPhoneStore(db);
    setFieldUser(userId);
    await db.open();
  });

  it("stores one report per transect and week (a Thursday and the Sunday after are one week), offline", async () => {
    const first = await reportWeatherMiss(transectId, "2026-06-11");
    expect(first).toMatchObject({ ownerId: userId, transectId, reportedOn: "2026-06-11", weekStart: "2026-06-08", outbox: "on-phone" });
    expect((await reportWeatherMiss(transectId, "2026-06-14")).id).toBe(first.id);
    // The next Monday starts a new week.
    expect((await reportWeatherMiss(transectId, "2026-06-15")).id).not.toBe(first.id);
    expect(await phoneStore().weatherMisses.count()).toBe(2);
    expect((await weatherReportFor(userId, transectId, "2026-06-09"))?.id).toBe(first.id);
    expect(await weatherReportFor(otherUser, transectId, "2026-06-09")).toBeUndefined();
    expect(await hasWorkToSend(userId)).toBe(true);
    expect(await hasWorkToSend(otherUser)).toBe(false);
    expect((await unsentOnPhone(userId)).weatherReports).toBe(2);
  });

  it("sends them in a protocol 2 batch of their own, marks them sent, and a resend changes nothing", async () => {
    const report = await reportWeatherMiss(transectId, "2026-06-11");
    const server = fakeServer();
    const run = await runOutbox(userId, server.fetcher);
    expect(run).toMatchObject({ sent: 1, needsAttention: 0, offline: false });
    expect(JSON.parse(server.bodies[0]!)).toEqual({
      protocol: SYNC_PROTOCOL_VERSION,
      visits: [],
      sightings: [],
      weatherMisses: [{ id: report.id, transectId, reportedOn: "2026-06-11", clientUpdatedAt: report.clientUpdatedAt }],
    });
    expect(await phoneStore().weatherMisses.get(report.id)).toMatchObject({ outbox: "sent", attention: null });
    expect(await hasWorkToSend(userId)).toBe(false);
    await runOutbox(userId, server.fetcher);
    expect(server.bodies).toHaveLength(1);
  });

  it("keeps them on the phone with no signal, and sends them once there is", async () => {
    const report = await reportWeatherMiss(transectId, "2026-06-11");
    const run = await runOutbox(userId, fakeServer({ down: true }).fetcher);
    expect(run).toMatchObject({ offline: true, retryLater: true, sent: 0 });
    expect(await phoneStore().weatherMisses.get(report.id)).toMatchObject({ outbox: "on-phone", attempts: 1 });
    const server = fakeServer();
    await runOutbox(userId, server.fetcher);
    expect(server.weather.has(report.id)).toBe(true);
    expect(await phoneStore().weatherMisses.get(report.id)).toMatchObject({ outbox: "sent" });
  });

  it("shows the server's refusal on the report, and a refused report can be taken back", async () => {
    const refused = await reportWeatherMiss(otherTransect, "2026-06-11");
    const fine = await reportWeatherMiss(transectId, "2026-06-11");
    const run = await runOutbox(userId, fakeServer({ forbidTransect: otherTransect }).fetcher);
    expect(run).toMatchObject({ sent: 1, needsAttention: 1 });
    expect(await phoneStore().weatherMisses.get(refused.id)).toMatchObject({ outbox: "needs-attention", attention: "You are not assigned to that transect." });
    expect(await phoneStore().weatherMisses.get(fine.id)).toMatchObject({ outbox: "sent" });
    // A refused report is not sent again on its own.
    expect(await hasWorkToSend(userId)).toBe(false);
    await withdrawWeatherMiss(refused.id);
    expect(await phoneStore().weatherMisses.get(refused.id)).toBeUndefined();
    await expect(withdrawWeatherMiss(fine.id)).rejects.toThrow(UNDO_TOO_LATE);
  });

  it("a report waiting on the phone can be taken back; only by its volunteer", async () => {
    const report = await reportWeatherMiss(transectId, "2026-06-11");
    setFieldUser(otherUser);
    await withdrawWeatherMiss(report.id);
    expect(await phoneStore().weatherMisses.get(report.id)).toBeDefined();
    setFieldUser(userId);
    await withdrawWeatherMiss(report.id);
    expect(await phoneStore().weatherMisses.get(report.id)).toBeUndefined();
  });

  it("refuses a report with nobody signed in", async () => {
    setFieldUser(null);
    await expect(reportWeatherMiss(transectId, "2026-06-11")).rejects.toThrow(/Sign in/);
  });
});

describe("the phone store's version 3", () => {
  it("adds the weather reports table and keeps every walk, record and photo a version 2 store held", async () => {
    const name = `test-${crypto.randomUUID()}`;
    // The store as version 2 of the phone code left it.
    const old = new Dexie(name);
    old.version(1).stores({ visits: "id, transectId, phase, outbox, visitDate", sightings: "id, visitId, outbox", photos: "id, visitId, sightingId, outbox", reference: "key", meta: "key" });
    old.version(2).stores({ visits: "id, transectId, phase, outbox, visitDate, ownerId" });
    const walk = (id: string, completeList: boolean, phase: "draft" | "submitted") => ({
      id, ownerId: userId, transectId, visitDate: "2026-05-02", startTime: "09:00", endTime: "10:00", temperatureC: 17, windBeaufort: 1, cloudCoverPercent: 10,
      sky: "clear", coRecorders: null, completeList, notes: null, phase, submittedAt: null, updatedAt: "2026-05-02T10:00:00.000Z",
      outbox: "on-phone", attention: null, attempts: 0, keptOnServer: null,
    });
    await old.table("visits").bulkAdd([walk("5b4c3d2e-1f0a-4b9c-8d7e-6f5a4b3c2d1e", true, "submitted"), walk("6b4c3d2e-1f0a-4b9c-8d7e-6f5a4b3c2d1e", false, "draft")]);
    await old.table("sightings").add({ id: "6c5d4e3f-2a1b-4c0d-9e8f-7a6b5c4d3e2f", visitId: "5b4c3d2e-1f0a-4b9c-8d7e-6f5a4b3c2d1e", speciesId: transectId, count: 2, section: 1, latitude: null, longitude: null, accuracyMetres: null, note: null, updatedAt: "2026-05-02T09:30:00.000Z", outbox: "on-phone", attention: null });
    await old.table("reference").put({ key: `field-reference:${userId}`, value: { savedAt: "x" }, savedAt: "x" });
    old.close();

    const db = new PhoneStore(name);
    setPhoneStore(db);
    setFieldUser(userId);
    await db.open();
    expect(db.verno).toBe(3);
    expect((await db.visits.get("5b4c3d2e-1f0a-4b9c-8d7e-6f5a4b3c2d1e"))?.completeList).toBe(true);
    expect((await db.visits.get("6b4c3d2e-1f0a-4b9c-8d7e-6f5a4b3c2d1e"))?.completeList).toBe(false);
    expect(await db.sightings.count()).toBe(1);
    expect(await db.reference.count()).toBe(1);
    expect(await db.weatherMisses.count()).toBe(0);
    await reportWeatherMiss(transectId, "2026-06-11");
    expect(await db.weatherMisses.count()).toBe(1);
    db.close();
  });
});
