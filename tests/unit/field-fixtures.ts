// Shared set-up for the field screens' component tests (jsdom + fake-indexeddb).
import "fake-indexeddb/auto";
import { PhoneStore, setFieldUser, setPhoneStore } from "@/lib/offline/phone-store";
import type { FieldReference } from "@/lib/offline/reference";

export const transectA = "6f1c1f7e-2b7a-4c1e-9a55-5d2f0c7b9a10";
export const transectB = "7a2d2e8f-3c8b-4d2f-8b66-6e3f1d8c0b21";
export const meadowBrown = "0b6f7a3c-8a35-4f3e-b6a4-1f2a3b4c5d6e";
export const smallWhite = "1c7f8b4d-9b46-4f4f-a7b5-2f3b4c5d6e7f";

export function fieldReference(): FieldReference {
  const transect = (id: string, code: string, name: string, sectionCount: number, coastal: boolean) => ({
    id,
    code,
    name,
    habitat: "Dune grassland",
    sectionCount,
    lengthMetres: 2400,
    coastal,
    accessNotes: null,
    route: null,
    lastVisit: null,
    visitsThisSeason: 0,
  });
  return {
    season: { id: "5e0b1d6c-7a24-4e3d-9c44-4e1a2b3c4d5e", name: "Summer 2026", startsOn: "2026-04-01", endsOn: "2026-09-30", targetVisits: 20 },
    seasons: [{ name: "Summer 2026", startsOn: "2026-04-01", endsOn: "2026-09-30", phase: "open" }],
    transects: [transect(transectA, "DUN-01", "North dunes", 8, true), transect(transectB, "DUN-02", "South slack", 4, false)],
    checklist: [
      { id: meadowBrown, scientificName: "Maniola jurtina", vernacularName: "Meadow Brown", taxonRank: "species", sensitive: false, activeMonths: null },
      { id: smallWhite, scientificName: "Pieris rapae", vernacularName: "Small White", taxonRank: "species", sensitive: false, activeMonths: null },
    ],
    seenByTransect: {},
    rules: { minTemperatureC: null, maxWindBeaufort: null, earliestStartTime: null, latestStartTime: null },
    safetyAcceptedAt: null,
    savedAt: "2026-07-01T08:00:00.000Z",
  } as unknown as FieldReference;
}

/** The volunteer signed in on the phone in the field screens' tests. */
export const fieldVolunteer = "3d9e0f1a-2b3c-4d5e-8f70-8192a3b4c5d6";
export const otherVolunteer = "9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d";

/**
 * A separately named IndexedDB for each test, so tests never see each other's records, with
 * `fieldVolunteer` signed in (walks are started and edited only by a signed-in volunteer).
 */
export function freshFieldDb(): PhoneStore {
  const db = new PhoneStore(`ui-test-${crypto.randomUUID()}`);
  setPhoneStore(db);
  setFieldUser(fieldVolunteer);
  return db;
}

/** jsdom has no object URLs: record what is made and let go, so tests can check nothing leaks. */
export function stubObjectUrls() {
  let n = 0;
  const made: string[] = [];
  const revoked: string[] = [];
  URL.createObjectURL = () => {
    const url = `blob:test/${++n}`;
    made.push(url);
    return url;
  };
  URL.revokeObjectURL = (url: string) => void revoked.push(url);
  return { made, revoked };
}

/** A tiny file with a JPEG's first bytes; its size differs with its name, so stored copies can be told apart. */
export const jpeg = (name: string) => new File([new Uint8Array([0xff, 0xd8, 0xff, 0xe0]), new TextEncoder().encode(name)], name, { type: "image/jpeg" });
