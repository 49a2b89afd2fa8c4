import { sql } from "drizzle-orm";
import { boolean, check, date, index, integer, jsonb, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { users } from "./people";

export const habitatGroups = pgTable("habitat_groups", {
  id: uuid("id").primaryKey().defaultRandom(),
  code: text("code").notNull().unique(),
  name: text("name").notNull(),
  description: text("description"),
});

/** A GeoJSON LineString in WGS84 (RFC 7946): [longitude, latitude] pairs. */
export type LineString = { type: "LineString"; coordinates: [number, number][] };

export const transects = pgTable(
  "transects",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    code: text("code").notNull().unique(),
    name: text("name").notNull(),
    habitatGroupId: uuid("habitat_group_id").notNull().references(() => habitatGroups.id, { onDelete: "restrict" }),
    route: jsonb("route").$type<LineString>().notNull(),
    sectionCount: integer("section_count").notNull(),
    lengthMetres: integer("length_metres").notNull(),
    // Shown to volunteers: access notes, tide times for coastal routes, hazards.
    accessNotes: text("access_notes"),
    coastal: boolean("coastal").notNull().default(false),
    active: boolean("active").notNull().default(true),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("transects_habitat_idx").on(t.habitatGroupId),
    check("transects_sections_positive", sql`${t.sectionCount} between 1 and 50`),
    check("transects_length_positive", sql`${t.lengthMetres} > 0`),
    check("transects_route_linestring", sql`${t.route}->>'type' = 'LineString' and jsonb_array_length(${t.route}->'coordinates') >= 2`),
  ],
);

export const seasonStatusEnum = pgEnum("season_status", ["planning", "open", "closed"]);

export const seasons = pgTable(
  "seasons",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    name: text("name").notNull().unique(),
    startsOn: date("starts_on").notNull(),
    endsOn: date("ends_on").notNull(),
    status: seasonStatusEnum("status").notNull().default("planning"),
    // Fewest verified visits a transect needs in this season to be compared.
    minVisits: integer("min_visits").notNull().default(1),
    // The visits each volunteer is asked to make per transect (shown on the field home).
    targetVisits: integer("target_visits").notNull().default(6),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    check("seasons_dates_ordered", sql`${t.endsOn} >= ${t.startsOn}`),
    check("seasons_min_visits", sql`${t.minVisits} >= 1`),
    check("seasons_target_visits", sql`${t.targetVisits} >= 1`),
  ],
);

export const transectAssignments = pgTable(
  "transect_assignments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    transectId: uuid("transect_id").notNull().references(() => transects.id, { onDelete: "cascade" }),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    assignedById: uuid("assigned_by_id").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("transect_assignments_pair_idx").on(t.transectId, t.userId), index("transect_assignments_user_idx").on(t.userId)],
);
