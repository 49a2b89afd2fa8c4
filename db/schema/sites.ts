import { sql } from "drizzle-orm";
import { boolean, check, date, index, integer, jsonb, pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { SECTIONS } from "../../lib/limits/counts";
import { literal } from "./check-sql";
import { users } from "./people";

export const habitatGroups = pgTable(
  "habitat_groups",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    code: text("code").notNull().unique(),
    name: text("name").notNull(),
    description: text("description"),
    // A key of lib/geo/palette.ts (our own accessible colours), not a free hex.
    colour: text("colour").notNull().default("slate"),
  },
  (t) => [uniqueIndex("habitat_groups_name_lower_idx").on(sql`lower(${t.name})`), check("habitat_groups_colour_key", sql`${t.colour} ~ '^[a-z]{1,32}$'`)],
);

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
    // The exact route leaves the server only for reviewers, organisers and assigned volunteers.
    sensitive: boolean("sensitive").notNull().default(false),
    // false once retired: nobody records on it, its history and past seasons stay.
    active: boolean("active").notNull().default(true),
    retiredAt: timestamp("retired_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("transects_habitat_idx").on(t.habitatGroupId),
    check("transects_sections_positive", sql`${t.sectionCount} between ${literal(SECTIONS.min)} and ${literal(SECTIONS.max)}`),
    check("transects_length_positive", sql`${t.lengthMetres} > 0`),
    check("transects_route_linestring", sql`${t.route}->>'type' = 'LineString' and jsonb_array_length(${t.route}->'coordinates') >= 2`),
  ],
);

/**
 * Every route a transect has had. transects.route, section_count and length_metres repeat the
 * latest version. A walk is measured against the version in force on its date (the latest
 * valid_from on or before it; the first version also covers earlier dates: lib/geo/versions.ts).
 */
export const transectRouteVersions = pgTable(
  "transect_route_versions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    transectId: uuid("transect_id").notNull().references(() => transects.id, { onDelete: "cascade" }),
    version: integer("version").notNull(),
    validFrom: date("valid_from").notNull(),
    route: jsonb("route").$type<LineString>().notNull(),
    sectionCount: integer("section_count").notNull(),
    lengthMetres: integer("length_metres").notNull(),
    createdById: uuid("created_by_id").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("transect_route_versions_number_idx").on(t.transectId, t.version),
    uniqueIndex("transect_route_versions_from_idx").on(t.transectId, t.validFrom),
    check("transect_route_versions_number_positive", sql`${t.version} >= 1`),
    check("transect_route_versions_sections", sql`${t.sectionCount} between ${literal(SECTIONS.min)} and ${literal(SECTIONS.max)}`),
    check("transect_route_versions_length_positive", sql`${t.lengthMetres} > 0`),
    check("transect_route_versions_linestring", sql`${t.route}->>'type' = 'LineString' and jsonb_array_length(${t.route}->'coordinates') >= 2`),
  ],
);

/** A version's sections: each its own stretch of the version's route, points from_point to to_point. */
export const transectSections = pgTable(
  "transect_sections",
  {
    versionId: uuid("version_id").notNull().references(() => transectRouteVersions.id, { onDelete: "cascade" }),
    number: integer("number").notNull(),
    fromPoint: integer("from_point").notNull(),
    toPoint: integer("to_point").notNull(),
    lengthMetres: integer("length_metres").notNull(),
    habitat: text("habitat"),
  },
  (t) => [
    primaryKey({ columns: [t.versionId, t.number] }),
    check("transect_sections_number", sql`${t.number} between ${literal(SECTIONS.min)} and ${literal(SECTIONS.max)}`),
    check("transect_sections_points", sql`${t.fromPoint} >= 0 and ${t.toPoint} > ${t.fromPoint}`),
    check("transect_sections_length", sql`${t.lengthMetres} >= 0`),
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
    openedAt: timestamp("opened_at", { withTimezone: true }),
    // Closing starts the grace period (network_settings.season_grace_days); after it the
    // season's records are frozen for analysis (lib/seasons/rules.ts).
    closedAt: timestamp("closed_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    check("seasons_dates_ordered", sql`${t.endsOn} >= ${t.startsOn}`),
    check("seasons_min_visits", sql`${t.minVisits} >= 1`),
    check("seasons_target_visits", sql`${t.targetVisits} >= 1`),
    check("seasons_closed_has_date", sql`(${t.status} = 'closed') = (${t.closedAt} is not null)`),
    // No two seasons overlap: an exclusion constraint on daterange(starts_on, ends_on, '[]')
    // added by hand in drizzle/0006 (drizzle-kit does not model EXCLUDE).
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

export const importStatusEnum = pgEnum("import_record_status", ["accepted", "pending"]);

/** One earlier season brought in from a walks file and a sightings file (lib/import). */
export const seasonImports = pgTable(
  "season_imports",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    seasonId: uuid("season_id").notNull().references(() => seasons.id, { onDelete: "restrict" }),
    // What the imported sightings were stored as: accepted (checked elsewhere) or waiting.
    recordStatus: importStatusEnum("record_status").notNull(),
    walksFileName: text("walks_file_name").notNull(),
    sightingsFileName: text("sightings_file_name").notNull(),
    // sha-256 of both files: the confirm step writes only what the preview showed.
    contentHash: text("content_hash").notNull(),
    walks: integer("walks").notNull(),
    sightings: integer("sightings").notNull(),
    createdById: uuid("created_by_id").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("season_imports_season_idx").on(t.seasonId), check("season_imports_counts", sql`${t.walks} >= 0 and ${t.sightings} >= 0`)],
);
