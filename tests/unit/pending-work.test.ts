import "fake-indexeddb/auto";
import { beforeEach, describe, expect, it } from "vitest";
import { PhoneStore, phoneStore, setPhoneStore, setFieldUser } from "@/lib/offline/phone-store";
import { runOutbox } from "@/lib/offline/outbox";
import { hasWorkToSend } from "@/lib/offline/pending-work";
import { addPhoto, addSighting, createVisit, submitVisit } from "@/lib/offline/records";
import { claimWalks, leaveWalks } from "@/lib/offline/unowned-walks";
import { fakeServer } from "./fake-sync-server";

// hasWorkToSend decides whether the sending code is loaded at all, so it must never say "no"
// when a pass would send something. Each case checks it against what a real pass then sends.
const alice = "3d5e7f90-1a2b-4c3d-8e4f-5a6b7c8d9e0f";
const bruno = "9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d";
const transectId = "6f1c1f7e-2b7a-4c1e-9a55-5d2f0c7b9a10";
const speciesId = "0b6f7a3c-8a35-4f3e-b6a4-1f2a3b4c5d6e";

async function visitBy(userId: string, options: { submit?: boolean; photo?: boolean } = {}) {
  setFieldUser(userId);
  const visitId = await createVisit({ transectId, visitDate: "2026-06-14", startTime: "10:30", temperatureC: 19, windBeaufort: 2, cloudCoverPercent: 20, sky: "mostly_sunny", coRecorders: null });
  await addSighting(visitId, { speciesId, count: 1, section: 1, latitude: null, longitude: null, accuracyMetres: null, note: null });
  if (options.photo) await addPhoto(visitId, null, new Blob([new Uint8Array(64)], { type: "image/jpeg" }));
  if (options.submit ?? true) await submitVisit(visitId, { endTime: "11:30", completeList: true, notes: null });
  return visitId;
}

/** What hasWorkToSend says, and whether a pass then really sent anything. */
async function claimAndTruth(userId: string, options: Parameters<typeof fakeServer>[0] = {}) {
  const said = await hasWorkToSend(userId);
  const server = fakeServer(options);
  await runOutbox(userId, server.fetcher);
  return { said, sent: server.requests.length > 0 };
}

describe("whether the outbox has anything to send", () => {
  beforeEach(() => {
    setPhoneStore(new PhoneStore(`test-${crypto.randomUUID()}`));
    setFieldUser(null);
  });

  it("says no for an empty phone and for drafts, and a pass indeed sends nothing", async () => {
    expect(await claimAndTruth(alice)).toEqual({ said: false, sent: false });
    await visitBy(alice, { submit: false });
    expect(await claimAndTruth(alice)).toEqual({ said: false, sent: false });
  });

  it("says yes for a submitted visit, and no once the pass has sent it", async () => {
    await visitBy(alice);
    expect(await claimAndTruth(alice)).toEqual({ said: true, sent: true });
    expect(await claimAndTruth(alice)).toEqual({ said: false, sent: false });
  });

  it("says yes for a photo still waiting after its visit went", async () => {
    await visitBy(alice, { photo: true });
    // The store answers the photo's PUT with a passing fault, so the photo stays on the phone.
    const firstPass = fakeServer({ photoOverride: (step) => (step === "put" ? new Response(null, { status: 503 }) : undefined) });
    await runOutbox(alice, firstPass.fetcher);
    const photo = (await phoneStore().photos.toArray())[0]!;
    if (photo.outbox === "sent") throw new Error("the fake store was meant to refuse the first upload");
    expect(await claimAndTruth(alice)).toEqual({ said: true, sent: true });
  });

  it("says no for someone else's visits and photos", async () => {
    const theirs = await visitBy(bruno, { photo: true });
    // Bruno's visit went, but his photo is still waiting on the phone.
    const store = phoneStore();
    await store.visits.update(theirs, { outbox: "sent" });
    await store.sightings.where("visitId").equals(theirs).modify({ outbox: "sent" });
    expect(await claimAndTruth(alice)).toEqual({ said: false, sent: false });
  });

  it("says no for a visit whose owner the phone does not know, until the volunteer says it is theirs", async () => {
    const legacy = await visitBy(bruno, { photo: true });
    await phoneStore().visits.update(legacy, { ownerId: null });
    expect(await claimAndTruth(alice)).toEqual({ said: false, sent: false });
    await leaveWalks(alice, [legacy]);
    expect(await claimAndTruth(alice)).toEqual({ said: false, sent: false });
    await claimWalks(alice, [legacy]);
    expect(await claimAndTruth(alice)).toEqual({ said: true, sent: true });
  });
});
