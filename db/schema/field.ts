import { sql } from "drizzle-orm";
import { boolean, check, date, doublePrecision, index, integer, pgEnum, pgTable, smallint, text, time, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { BEAUFORT_FORCE, CLOUD_COVER_PERCENT, SECTIONS, SIGHTING_COUNT, SUNSHINE_PERCENT, TEMPERATURE_C } from "../../lib/limits/counts";
import { literal } from "./check-sql";
import { users } from "./people";
import { seasonImports, seasons, transects } from "./sites";
import { species } from "./taxa";

export const skyEnum = pgEnum("sky", ["clear", "mostly_sunny", "broken_cloud", "mostly_cloudy", "overcast"]);
export const rainEnum = pgEnum("rain", ["none", "light", "heavy"]);

/** A walk of one transect on one day. The id is generated on the phone, so resends are idempotent. */
export const visits = pgTable(
  "visits",
  {
    id: uuid("id").primaryKey(),
    transectId: uuid("transect_id").notNull().references(() => transects.id, { onDelete: "restrict" }),
    volunteerId: uuid("volunteer_id").notNull().references(() => users.id, { onDelete: "restrict" }),
    seasonId: uuid("season_id").references(() => seasons.id, { onDelete: "set null" }),
    visitDate: date("visit_date").notNull(),
    startTime: time("start_time").notNull(),
    endTime: time("end_time"),
    temperatureC: doublePrecision("temperature_c"),
    windBeaufort: smallint("wind_beaufort"),
    cloudCoverPercent: smallint("cloud_cover_percent"),
    sky: skyEnum("sky"),
    // Share of the walk in sunshine, and rain during it: optional, older phones do not send them.
    sunshinePercent: smallint("sunshine_percent"),
    rain: rainEnum("rain"),
    // The network's walk rules this walk broke (lib/review/walk-rules.ts), kept by a trigger
    // (drizzle/0008) from the walk's conditions and network_settings.walk_rules.
    ruleBreaches: text("rule_breaches").array().notNull().default(sql`'{}'::text[]`),
    coRecorders: text("co_recorders"),
    // Absences are inferred only from complete lists.
    completeList: boolean("complete_list").notNull().default(false),
    notes: text("notes"),
    // Set when a reviewer or organiser typed the walk in for the volunteer (a paper record).
    enteredById: uuid("entered_by_id").references(() => users.id, { onDelete: "restrict" }),
    // Set when the walk came from an earlier season's spreadsheet.
    importId: uuid("import_id").references(() => seasonImports.id, { onDelete: "restrict" }),
    submittedAt: timestamp("submitted_at", { withTimezone: true }),
    clientUpdatedAt: timestamp("client_updated_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("visits_transect_date_idx").on(t.transectId, t.visitDate),
    // The review queue's default order (newest walk first), for filters that match most sightings.
    index("visits_date_id_idx").on(t.visitDate.desc().nullsFirst(), t.id),
    index("visits_volunteer_idx").on(t.volunteerId, t.visitDate),
    index("visits_season_idx").on(t.seasonId),
    index("visits_import_idx").on(t.importId),
    check("visits_wind_beaufort", sql`${t.windBeaufort} is null or ${t.windBeaufort} between ${literal(BEAUFORT_FORCE.min)} and ${literal(BEAUFORT_FORCE.max)}`),
    check("visits_sunshine_percent", sql`${t.sunshinePercent} is null or ${t.sunshinePercent} between ${literal(SUNSHINE_PERCENT.min)} and ${literal(SUNSHINE_PERCENT.max)}`),
    index("visits_rule_breaches_idx").on(t.id).where(sql`cardinality(${t.ruleBreaches}) > 0`),
    check("visits_cloud_percent", sql`${t.cloudCoverPercent} is null or ${t.cloudCoverPercent} between ${literal(CLOUD_COVER_PERCENT.min)} and ${literal(CLOUD_COVER_PERCENT.max)}`),
    check("visits_temperature_plausible", sql`${t.temperatureC} is null or ${t.temperatureC} between ${literal(TEMPERATURE_C.min)} and ${literal(TEMPERATURE_C.max)}`),
    check("visits_times_ordered", sql`${t.endTime} is null or ${t.endTime} >= ${t.startTime}`),
  ],
);

/**
 * "Not walked this week because of the weather", reported from the field home (offline too, so the
 * id comes from the phone like a visit's). One per volunteer, transect and week (Monday).
 */
export const weatherMisses = pgTable(
  "weather_misses",
  {
    id: uuid("id").primaryKey(),
    transectId: uuid("transect_id").notNull().references(() => transects.id, { onDelete: "restrict" }),
    volunteerId: uuid("volunteer_id").notNull().references(() => users.id, { onDelete: "restrict" }),
    seasonId: uuid("season_id").notNull().references(() => seasons.id, { onDelete: "restrict" }),
    weekStart: date("week_start").notNull(),
    reportedOn: date("reported_on").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("weather_misses_week_idx").on(t.transectId, t.volunteerId, t.weekStart),
    index("weather_misses_season_idx").on(t.seasonId, t.transectId),
    check("weather_misses_monday", sql`extract(isodow from ${t.weekStart}) = 1`),
  ],
);

export const sightingStatusEnum = pgEnum("sighting_status", ["pending", "accepted", "queried", "rejected"]);
export type SightingStatus = (typeof sightingStatusEnum.enumValues)[number];

export const sightings = pgTable(
  "sightings",
  {
    id: uuid("id").primaryKey(),
    visitId: uuid("visit_id").notNull().references(() => visits.id, { onDelete: "cascade" }),
    speciesId: uuid("species_id").notNull().references(() => species.id, { onDelete: "restrict" }),
    count: integer("count").notNull().default(1),
    section: smallint("section"),
    latitude: doublePrecision("latitude"),
    longitude: doublePrecision("longitude"),
    accuracyMetres: doublePrecision("accuracy_metres"),
    note: text("note"),
    status: sightingStatusEnum("status").notNull().default("pending"),
    reviewedById: uuid("reviewed_by_id").references(() => users.id, { onDelete: "set null" }),
    reviewedAt: timestamp("reviewed_at", { withTimezone: true }),
    // Raised by a trigger on every change a person makes (drizzle/0008): two reviewers acting on
    // one sighting compare it with the revision they were shown.
    revision: integer("revision").notNull().default(1),
    // What a reviewer should look at (lib/review/warnings.ts), kept by triggers (drizzle/0008).
    warnings: text("warnings").array().notNull().default(sql`'{}'::text[]`),
    clientUpdatedAt: timestamp("client_updated_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("sightings_visit_idx").on(t.visitId),
    index("sightings_species_idx").on(t.speciesId),
    index("sightings_status_idx").on(t.status),
    index("sightings_warnings_idx").using("gin", t.warnings),
    check("sightings_count_nonnegative", sql`${t.count} >= ${literal(SIGHTING_COUNT.min)}`),
    check("sightings_section_positive", sql`${t.section} is null or ${t.section} >= ${literal(SECTIONS.min)}`),
    check("sightings_latitude", sql`${t.latitude} is null or ${t.latitude} between -90 and 90`),
    check("sightings_longitude", sql`${t.longitude} is null or ${t.longitude} between -180 and 180`),
    check("sightings_position_pair", sql`(${t.latitude} is null) = (${t.longitude} is null)`),
  ],
);

export const photoStatusEnum = pgEnum("photo_status", ["awaiting_upload", "processing", "ready", "refused"]);

export const photos = pgTable(
  "photos",
  {
    id: uuid("id").primaryKey(),
    sightingId: uuid("sighting_id").references(() => sightings.id, { onDelete: "cascade" }),
    visitId: uuid("visit_id").notNull().references(() => visits.id, { onDelete: "cascade" }),
    uploadedById: uuid("uploaded_by_id").notNull().references(() => users.id, { onDelete: "restrict" }),
    status: photoStatusEnum("status").notNull().default("awaiting_upload"),
    // Object keys in the private bucket; nothing here is ever public.
    uploadKey: text("upload_key").notNull(),
    displayKey: text("display_key"),
    thumbnailKey: text("thumbnail_key"),
    contentType: text("content_type"),
    bytes: integer("bytes"),
    width: integer("width"),
    height: integer("height"),
    refusalReason: text("refusal_reason"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    processedAt: timestamp("processed_at", { withTimezone: true }),
  },
  (t) => [
    index("photos_sighting_idx").on(t.sightingId),
    index("photos_visit_idx").on(t.visitId),
    check("photos_bytes_nonnegative", sql`${t.bytes} is null or ${t.bytes} >= 0`),
  ],
);
