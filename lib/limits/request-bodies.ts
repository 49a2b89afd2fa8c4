// The one place where every request body's size cap is stated. Route handlers name one of these
// in their route() options (`bodyLimit: "syncBatch"`; lib/http/route.ts); a body past its cap
// stops being read and is answered 413 (lib/http/read-body.ts). Relative imports only: next.config.ts
// reads this file at build time, where the "@/" alias does not resolve.
import { MAX_IMPORT_FILE_BYTES } from "../import/limits";
import { MAX_SYNC_BODY_BYTES } from "../sync/protocol";

export const requestBodyLimits = {
  /** The default for JSON bodies: an invitation, a reply, a photo ticket request are well under 2 kB. */
  json: 64 * 1024,
  /**
   * A sync batch from the phone's outbox: the protocol's own number, so the phone (which plans its
   * batches under it, lib/offline/outbox-batches.ts) and the server share it.
   */
  syncBatch: MAX_SYNC_BODY_BYTES,
  /**
   * Server actions (sign-in, invitations, people, accepting an invitation): Next reads these bodies
   * itself, so the cap goes to `experimental.serverActions.bodySizeLimit` in next.config.ts. Our
   * actions take a few short text fields; 1 MiB is Next's own default, stated here deliberately
   * so that raising it is a decision made in this file.
   */
  serverAction: 1024 * 1024,
  /** A route file (at most 10 MB: MAX_ROUTE_FILE_BYTES in lib/geo/limits.ts) sent as a JSON string, which escaping can at most double. */
  routeFile: 2 * 10 * 1024 * 1024 + 64 * 1024,
  /** A checklist CSV (at most 10 MB: MAX_CHECKLIST_FILE_BYTES in lib/checklist/limits.ts) sent as a JSON string, which escaping can at most double. */ checklistFile: 2 * 10 * 1024 * 1024 + 64 * 1024,
  /**
   * An earlier season's walks and sightings files (each at most MAX_IMPORT_FILE_BYTES, lib/import/limits.ts) in
   * one multipart form, with room for the form's other fields and boundaries; a single file over its own cap
   * is answered 413 by the import's routes.
   */
  seasonImport: 2 * MAX_IMPORT_FILE_BYTES + 64 * 1024,
  /**
   * A bulk review of up to 5,000 selected sightings (BULK_LIMIT, lib/review/queue-filter.ts), each an
   * id and a revision (about 70 bytes in JSON), with a note: 512 kB leaves room and no more.
   */
  reviewBulk: 512 * 1024,
} as const;

export type RequestBodyLimit = keyof typeof requestBodyLimits;
