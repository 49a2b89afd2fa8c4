import { integer, pgTable, uuid } from "drizzle-orm/pg-core";
import { visits } from "./field";

/**
 * Each walk's sightings counted by status, so the organiser's home and its weekly grid read one
 * small row per walk instead of counting every sighting. Kept by statement-level triggers on
 * sightings (insert, update, delete, truncate; drizzle/0007), so every writer (sync, review,
 * paper walks, imports, merges, erasure) keeps it fresh in its own transaction without knowing
 * about it. A walk without a row has no sightings; a deleted walk takes its row with it.
 */
export const visitSummaries = pgTable("visit_summaries", {
  visitId: uuid("visit_id")
    .primaryKey()
    .references(() => visits.id, { onDelete: "cascade" }),
  pending: integer("pending").notNull().default(0),
  queried: integer("queried").notNull().default(0),
  accepted: integer("accepted").notNull().default(0),
  rejected: integer("rejected").notNull().default(0),
});
