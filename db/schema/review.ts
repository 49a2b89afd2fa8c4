import { index, integer, pgEnum, pgTable, primaryKey, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { sightingStatusEnum, sightings } from "./field";
import { users } from "./people";
import { seasons, transects } from "./sites";
import { species } from "./taxa";

export const reviewActionEnum = pgEnum("review_action", ["accept", "query", "reject", "reopen", "reply", "edit"]);

/**
 * Append-only trail of every review step and every volunteer reply, written in the transaction
 * of the change it records; a trigger (drizzle/0008) refuses any update, and any delete while
 * its sighting exists. "edit" is a correction of the species or the count: the old and new
 * values are kept here, the species also by name, so the trail still reads after a merge.
 */
export const verificationEvents = pgTable(
  "verification_events",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    sightingId: uuid("sighting_id").notNull().references(() => sightings.id, { onDelete: "cascade" }),
    actorId: uuid("actor_id").notNull().references(() => users.id, { onDelete: "restrict" }),
    action: reviewActionEnum("action").notNull(),
    fromStatus: sightingStatusEnum("from_status"),
    toStatus: sightingStatusEnum("to_status"),
    message: text("message"),
    // A rejection's reason, a key of lib/review/reasons.ts; the free text is in message.
    reason: text("reason"),
    fromSpeciesId: uuid("from_species_id"),
    fromSpeciesName: text("from_species_name"),
    toSpeciesId: uuid("to_species_id"),
    toSpeciesName: text("to_species_name"),
    fromCount: integer("from_count"),
    toCount: integer("to_count"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("verification_events_sighting_idx").on(t.sightingId, t.createdAt)],
);

/**
 * Checked (accepted) sightings summed per transect, species and season: the "earlier seasons"
 * behind the warnings and the detail's earlier counts. Kept by statement-level triggers on
 * sightings and visits (drizzle/0008), like visit_summaries; a group without accepted
 * sightings has no row.
 */
export const transectSpeciesSeasons = pgTable(
  "transect_species_seasons",
  {
    transectId: uuid("transect_id").notNull().references(() => transects.id, { onDelete: "cascade" }),
    speciesId: uuid("species_id").notNull().references(() => species.id, { onDelete: "cascade" }),
    seasonId: uuid("season_id").notNull().references(() => seasons.id, { onDelete: "cascade" }),
    sightings: integer("sightings").notNull(),
    total: integer("total").notNull(),
    maxCount: integer("max_count").notNull(),
  },
  (t) => [primaryKey({ columns: [t.transectId, t.speciesId, t.seasonId] }), index("transect_species_seasons_season_idx").on(t.seasonId, t.transectId)],
);
