import type { SightingStatus } from "@/db/schema/field";
import type { LineString } from "@/db/schema/sites";
import type { QueueFilter } from "./queue-filter";
import type { RejectReason } from "./reasons";
import type { WalkBreach } from "./walk-rules";
import type { SightingWarning } from "./warnings";

// What the review API answers, shared by its route handlers and the queue's screens. Dates are
// ISO strings (walk dates YYYY-MM-DD). Paths:
//   GET  /api/review/sightings?<queue-filter.ts parameters>         -> QueuePage
//   GET  /api/review/sightings/:id                                   -> SightingDetail
//   POST /api/review/sightings/:id/actions  ReviewActionInput        -> ActionResult | 409 Conflict
//   POST /api/review/bulk                   BulkInput                -> BulkResult
//   GET  /api/review/species?q=                                      -> { species: SpeciesChoice[] } (correction targets)
//   GET  /api/review/options                                         -> QueueOptions (filter choices)

export type SpeciesRef = { id: string; vernacularName: string; scientificName: string; aggregate: boolean };

export type QueueRow = {
  id: string;
  /** Send it back with an action: the server answers 409 when the sighting changed since. */
  revision: number;
  status: SightingStatus;
  /** The volunteer answered the last question (from the history; the status stays "queried"). */
  answered: boolean;
  /** A reviewer corrected its species or count at some point. */
  corrected: boolean;
  count: number;
  section: number | null;
  species: SpeciesRef;
  transect: { id: string; code: string; name: string };
  /** enteredBy: who typed in a paper walk; importedFrom: the earlier season's file, in words (lib/import/walk-source.ts). */
  walk: { id: string; date: string; breaches: WalkBreach[]; enteredBy: string | null; importedFrom: string | null };
  volunteer: { id: string; name: string };
  photoCount: number;
  /** A small signed image URL of the first ready photo, or null. */
  thumbnailUrl: string | null;
  warnings: SightingWarning[];
  /** Entries of the same species in the same section of the same walk: the volunteer's tally. */
  tally: { entries: number; sum: number };
};

export type QueuePage = {
  rows: QueueRow[];
  total: number;
  page: number;
  pageSize: number;
  /** The server's time when the page was read: bulk actions skip sightings changed after it. */
  listedAt: string;
};

export type HistoryEntry = {
  id: string;
  action: "accept" | "query" | "reject" | "reopen" | "reply" | "edit";
  actor: { id: string; name: string };
  at: string;
  fromStatus: SightingStatus | null;
  toStatus: SightingStatus | null;
  reason: RejectReason | null;
  message: string | null;
  fromSpecies: { id: string | null; name: string } | null;
  toSpecies: { id: string | null; name: string } | null;
  fromCount: number | null;
  toCount: number | null;
};

export type SightingDetail = QueueRow & {
  note: string | null;
  position: { latitude: number; longitude: number; accuracyMetres: number | null } | null;
  sensitive: boolean;
  photos: { id: string; thumbnailUrl: string; displayUrl: string; width: number | null; height: number | null }[];
  walkDetail: {
    startTime: string;
    endTime: string | null;
    temperatureC: number | null;
    windBeaufort: number | null;
    cloudCoverPercent: number | null;
    sunshinePercent: number | null;
    rain: "none" | "light" | "heavy" | null;
    completeList: boolean;
    notes: string | null;
    /** The walk rules' words for each breach, with the network's numbers. */
    breachTexts: string[];
  };
  /** The route in force on the walk's date, with its section count. */
  route: { line: LineString; sectionCount: number };
  /** Checked sightings of this species on this transect, per season, oldest first. */
  earlier: { seasonId: string; seasonName: string; sightings: number; total: number; maxCount: number }[];
  history: HistoryEntry[];
  /** Whether a reopen is allowed now (its season is open or in its grace period). */
  canReopen: boolean;
};

export type ReviewActionInput =
  | { action: "accept"; revision: number; message?: string }
  | { action: "query"; revision: number; message: string }
  | { action: "reject"; revision: number; reason: RejectReason; message?: string }
  | { action: "edit"; revision: number; speciesId?: string; count?: number; message?: string }
  | { action: "reopen"; revision: number; message?: string };

export type ActionResult = { row: QueueRow };

/** 409: someone else changed it since it was shown; row is how it stands now. */
export type Conflict = { error: { code: "changed"; message: string; changedBy: string | null; changedAt: string | null }; row: QueueRow };

export type BulkSelection = { ids: { id: string; revision: number }[] } | { filter: QueueFilter; listedAt: string };
/** A set-aside needs its reason; the selection is either ids with their revisions, or a filter and when its list was read. */
export type BulkInput = { action: "accept"; selection: BulkSelection; message?: string } | { action: "reject"; selection: BulkSelection; reason: RejectReason; message?: string };

export type BulkResult = {
  done: number;
  /** Sightings left as they were, with why: changed by someone since listed, has warnings (accept), or already decided. */
  skipped: { id: string; why: "changed" | "has_warnings" | "not_waiting" }[];
};

export type QueueOptions = {
  seasons: { id: string; name: string }[];
  transects: { id: string; code: string; name: string }[];
  habitats: { id: string; name: string }[];
  volunteers: { id: string; name: string }[];
};

export type SpeciesChoice = SpeciesRef & { members: string[] };
