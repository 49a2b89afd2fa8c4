import Dexie, { type EntityTable } from "dexie";

// Everything a volunteer records is written here first, keyed by ids made on the phone,
// so nothing depends on a signal and a resend can never create a second copy.

/** Where an item stands between the phone and the server. */
export type OutboxState = "on-phone" | "sending" | "sent" | "needs-attention";

export type LocalVisit = {
  id: string;
  transectId: string;
  visitDate: string;
  startTime: string;
  endTime: string | null;
  temperatureC: number | null;
  windBeaufort: number | null;
  cloudCoverPercent: number | null;
  sky: "clear" | "mostly_sunny" | "broken_cloud" | "mostly_cloudy" | "overcast" | null;
  coRecorders: string | null;
  completeList: boolean;
  notes: string | null;
  /** Drafts stay on the phone; a submitted visit joins the outbox and can no longer be edited. */
  phase: "draft" | "submitted";
  submittedAt: string | null;
  updatedAt: string;
  outbox: OutboxState;
  attention: string | null;
  attempts: number;
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

/** Cached server data the field screens need offline (checklist, transects, rules). */
export type ReferenceEntry = { key: string; value: unknown; savedAt: string };
export type MetaEntry = { key: string; value: unknown };

export class FieldDatabase extends Dexie {
  visits!: EntityTable<LocalVisit, "id">;
  sightings!: EntityTable<LocalSighting, "id">;
  photos!: EntityTable<LocalPhoto, "id">;
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
  }
}

let instance: FieldDatabase | undefined;

export function fieldDb(): FieldDatabase {
  instance ??= new FieldDatabase();
  return instance;
}

/** For tests: use a separately named database. */
export function setFieldDb(db: FieldDatabase): void {
  instance = db;
}
