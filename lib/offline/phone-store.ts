import Dexie, { type EntityTable } from "dexie";

// Everything a volunteer records is written here first, keyed by ids made on the phone,
// so nothing depends on a signal and a resend can never create a second copy.

/** Where an item stands between the phone and the server. */
export type OutboxState = "on-phone" | "sending" | "sent" | "needs-attention";

/** What the server kept in place of the phone's later edit (it was reviewed, or newer). */
export type KeptOnServer = { visit: boolean; sightings: number };

export type LocalVisit = {
  id: string;
  /**
   * The signed-in volunteer who recorded it (`createVisit` refuses to start a walk without one),
   * so a shared phone sends, lists and edits each person's own visits only. Empty on visits
   * recorded before owners were kept. The server checks every item again.
   */
  ownerId?: string | null;
  /** On a visit without an owner: the volunteers who said it is not theirs (lib/offline/unowned-walks.ts). */
  leftBy?: string[];
  transectId: string;
  visitDate: string;
  startTime: string;
  endTime: string | null;
  temperatureC: number | null;
  windBeaufort: number | null;
  cloudCoverPercent: number | null;
  sky: "clear" | "mostly_sunny" | "broken_cloud" | "mostly_cloudy" | "overcast" | null;
  /**
   * Share of the walk in sunshine (whole percent) and rain during it. Absent on walks stored
   * before they were asked (not indexed, so no store version was needed): read absent as null.
   */
  sunshinePercent?: number | null;
  rain?: "none" | "light" | "heavy" | null;
  coRecorders: string | null;
  /**
   * The answer to "Did you record every species you saw?": null until the volunteer answers at the
   * end of the walk (asked every time, nothing chosen in advance). Walks stored before the
   * question was asked keep the value they had.
   */
  completeList: boolean | null;
  notes: string | null;
  /** Drafts stay on the phone; a submitted visit joins the outbox and can no longer be edited. */
  phase: "draft" | "submitted";
  submittedAt: string | null;
  updatedAt: string;
  outbox: OutboxState;
  attention: string | null;
  attempts: number;
  /** Sent, but the server kept its copy of the visit or of some sightings: the volunteer is told. */
  keptOnServer?: KeptOnServer | null;
};

export type LocalSighting = {
  id: string;
  visitId: string;
  speciesId: string;
  count: number;
  section: number | null;
  latitude: number | null;
  longitude: number | null;
  accuracyMetres: number | null;
  note: string | null;
  updatedAt: string;
  outbox: OutboxState;
  attention: string | null;
};

export type LocalPhoto = {
  id: string;
  visitId: string;
  sightingId: string | null;
  blob: Blob;
  contentType: string;
  bytes: number;
  createdAt: string;
  outbox: OutboxState;
  attention: string | null;
  attempts: number;
};

/**
 * "Not walked this week because of the weather", tapped on the field home. The server files it
 * under the Monday of `reportedOn`'s week; `weekStart` is that Monday, so the home can show this
 * week's reports without its own arithmetic. Never edited: it can be taken back while unsent.
 */
export type LocalWeatherMiss = {
  id: string;
  /** The volunteer who reported it (only theirs are shown and sent). */
  ownerId: string;
  transectId: string;
  /** The phone's local date of the tap, YYYY-MM-DD. */
  reportedOn: string;
  weekStart: string;
  clientUpdatedAt: string;
  outbox: OutboxState;
  attention: string | null;
  attempts: number;
};

/** Cached server data the field screens need offline (checklist, transects, rules). */
export type ReferenceEntry = { key: string; value: unknown; savedAt: string };
export type MetaEntry = { key: string; value: unknown };

// The volunteer signed in on this page, set by the field layout before its screens render.
let signedInUserId: string | null = null;

/** Records who is signed in, so new visits carry their owner. */
export function setFieldUser(userId: string | null): void {
  signedInUserId = userId;
}

export function fieldUser(): string | null {
  return signedInUserId;
}

/** An item the outbox still has to send ("sending" too: a tab closed mid-request leaves it so). */
export function isWaiting(state: OutboxState): boolean {
  return state === "on-phone" || state === "sending";
}

/**
 * A visit shown to, edited by and sent for this volunteer: theirs alone. A visit recorded before
 * owners were kept is nobody's until a volunteer says it is theirs (./unowned-walks.ts).
 */
export function belongsTo(visit: Pick<LocalVisit, "ownerId">, userId: string | null): boolean {
  return userId != null && visit.ownerId === userId;
}

export class PhoneStore extends Dexie {
  visits!: EntityTable<LocalVisit, "id">;
  sightings!: EntityTable<LocalSighting, "id">;
  photos!: EntityTable<LocalPhoto, "id">;
  weatherMisses!: EntityTable<LocalWeatherMiss, "id">;
  reference!: EntityTable<ReferenceEntry, "key">;
  meta!: EntityTable<MetaEntry, "key">;

  constructor(name = "turnstone-field") {
    super(name);
    this.version(1).stores({
      visits: "id, transectId, phase, outbox, visitDate",
      sightings: "id, visitId, outbox",
      photos: "id, visitId, sightingId, outbox",
      reference: "key",
      meta: "key",
    });
    // Version 2: visits have an owner. Older visits get an explicit empty owner: the volunteer
    // who recorded them says so on the field home (./unowned-walks.ts).
    this.version(2)
      .stores({ visits: "id, transectId, phase, outbox, visitDate, ownerId" })
      .upgrade((tx) =>
        tx
          .table<LocalVisit>("visits")
          .toCollection()
          .modify((visit) => {
            visit.ownerId ??= null;
            visit.keptOnServer ??= null;
          }),
      );
    // Version 3: weather reports. A new table only: every stored walk, record and photo stays as it
    // was (a walk's completeList keeps its true or false; new walks start with null, not answered).
    this.version(3).stores({ weatherMisses: "id, ownerId, transectId, weekStart, outbox" });
  }
}

let instance: PhoneStore | undefined;

export function phoneStore(): PhoneStore {
  instance ??= new PhoneStore();
  return instance;
}

/** For tests: use a separately named database. */
export function setPhoneStore(db: PhoneStore): void {
  instance = db;
}
