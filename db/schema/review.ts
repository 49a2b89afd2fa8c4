import { index, pgEnum, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { sightingStatusEnum, sightings } from "./field";
import { users } from "./people";

export const reviewActionEnum = pgEnum("review_action", ["accept", "query", "reject", "reopen", "reply", "edit"]);

/** Append-only trail of every review step and every volunteer reply. */
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
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("verification_events_sighting_idx").on(t.sightingId, t.createdAt)],
);
