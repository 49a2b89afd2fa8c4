import { index, jsonb, pgEnum, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { users } from "./people";

/** What part of the network an organiser changed. */
export const networkEntityEnum = pgEnum("network_entity", [
  "transect",
  "habitat_group",
  "species",
  "species_tag",
  "season",
  "person",
  "assignment",
  "agreement",
  "settings",
  "import",
]);

/**
 * The network's change log: every change an organiser makes, with who, when, what, and the
 * values before and after. Written in the same transaction as the change; never edited by the
 * app (a person's erasure replaces their name with their pseudonym, see lib/queries/people).
 */
export const networkChanges = pgTable(
  "network_changes",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    entity: networkEntityEnum("entity").notNull(),
    entityId: text("entity_id"),
    // A short verb: create, update, retire, merge, open, close, import, ...
    action: text("action").notNull(),
    summary: text("summary").notNull(),
    before: jsonb("before"),
    after: jsonb("after"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  // The history page reads newest first by (created_at, id), whole or by entity (and id), with
  // keyset cursors: each index ends in both columns, so each page is one index range read
  // backwards, however long the log grows.
  (t) => [
    index("network_changes_created_idx").on(t.createdAt, t.id),
    index("network_changes_entity_time_idx").on(t.entity, t.createdAt, t.id),
    index("network_changes_entity_idx").on(t.entity, t.entityId, t.createdAt, t.id),
  ],
);
