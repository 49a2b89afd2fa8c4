CREATE TYPE "public"."rain" AS ENUM('none', 'light', 'heavy');--> statement-breakpoint
CREATE TABLE "transect_species_seasons" (
	"transect_id" uuid NOT NULL,
	"species_id" uuid NOT NULL,
	"season_id" uuid NOT NULL,
	"sightings" integer NOT NULL,
	"total" integer NOT NULL,
	"max_count" integer NOT NULL,
	CONSTRAINT "transect_species_seasons_transect_id_species_id_season_id_pk" PRIMARY KEY("transect_id","species_id","season_id")
);
--> statement-breakpoint
ALTER TABLE "network_settings" DROP CONSTRAINT "network_settings_wind";--> statement-breakpoint
ALTER TABLE "network_settings" ADD COLUMN "walk_rules" jsonb DEFAULT '{"windowStart":"10:45","windowEnd":"15:45","coolMinimumC":13,"coolSunshinePercent":60,"warmEnoughC":17,"maxWindBeaufort":5,"rainAllowed":false}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "network_settings" ADD COLUMN "warning_rules" jsonb DEFAULT '{"countFactor":3,"countMinimum":10,"firstRecordMinSeasons":2}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "sightings" ADD COLUMN "revision" integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE "sightings" ADD COLUMN "warnings" text[] DEFAULT '{}'::text[] NOT NULL;--> statement-breakpoint
ALTER TABLE "visits" ADD COLUMN "sunshine_percent" smallint;--> statement-breakpoint
ALTER TABLE "visits" ADD COLUMN "rain" "rain";--> statement-breakpoint
ALTER TABLE "visits" ADD COLUMN "rule_breaches" text[] DEFAULT '{}'::text[] NOT NULL;--> statement-breakpoint
ALTER TABLE "verification_events" ADD COLUMN "reason" text;--> statement-breakpoint
ALTER TABLE "verification_events" ADD COLUMN "from_species_id" uuid;--> statement-breakpoint
ALTER TABLE "verification_events" ADD COLUMN "from_species_name" text;--> statement-breakpoint
ALTER TABLE "verification_events" ADD COLUMN "to_species_id" uuid;--> statement-breakpoint
ALTER TABLE "verification_events" ADD COLUMN "to_species_name" text;--> statement-breakpoint
ALTER TABLE "verification_events" ADD COLUMN "from_count" integer;--> statement-breakpoint
ALTER TABLE "verification_events" ADD COLUMN "to_count" integer;--> statement-breakpoint
ALTER TABLE "transect_species_seasons" ADD CONSTRAINT "transect_species_seasons_transect_id_transects_id_fk" FOREIGN KEY ("transect_id") REFERENCES "public"."transects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "transect_species_seasons" ADD CONSTRAINT "transect_species_seasons_species_id_species_id_fk" FOREIGN KEY ("species_id") REFERENCES "public"."species"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "transect_species_seasons" ADD CONSTRAINT "transect_species_seasons_season_id_seasons_id_fk" FOREIGN KEY ("season_id") REFERENCES "public"."seasons"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "transect_species_seasons_season_idx" ON "transect_species_seasons" USING btree ("season_id","transect_id");--> statement-breakpoint
CREATE INDEX "sightings_warnings_idx" ON "sightings" USING gin ("warnings");--> statement-breakpoint
CREATE INDEX "visits_rule_breaches_idx" ON "visits" USING btree ("id") WHERE cardinality("visits"."rule_breaches") > 0;--> statement-breakpoint
ALTER TABLE "visits" ADD CONSTRAINT "visits_sunshine_percent" CHECK ("visits"."sunshine_percent" is null or "visits"."sunshine_percent" between 0 and 100);--> statement-breakpoint
ALTER TABLE "network_settings" DROP COLUMN "min_temperature_c";--> statement-breakpoint
ALTER TABLE "network_settings" DROP COLUMN "max_wind_beaufort";--> statement-breakpoint
ALTER TABLE "network_settings" DROP COLUMN "earliest_start_time";--> statement-breakpoint
ALTER TABLE "network_settings" DROP COLUMN "latest_start_time";
--> statement-breakpoint
-- Hand-written from here: the review queue's rules and the triggers that keep their results.
-- The same rules in TypeScript: lib/review/walk-rules.ts and lib/review/warnings.ts; the
-- integration tests hold the two equal.
--
-- The network's rules, or the defaults (lib/review/*-rules.ts) before the settings row exists.
CREATE FUNCTION "network_walk_rules"() RETURNS jsonb LANGUAGE sql STABLE AS $$
  SELECT coalesce((SELECT "walk_rules" FROM "network_settings" WHERE "id" = 1),
    '{"windowStart":"10:45","windowEnd":"15:45","coolMinimumC":13,"coolSunshinePercent":60,"warmEnoughC":17,"maxWindBeaufort":5,"rainAllowed":false}'::jsonb)
$$;--> statement-breakpoint
CREATE FUNCTION "network_warning_rules"() RETURNS jsonb LANGUAGE sql STABLE AS $$
  SELECT coalesce((SELECT "warning_rules" FROM "network_settings" WHERE "id" = 1),
    '{"countFactor":3,"countMinimum":10,"firstRecordMinSeasons":2}'::jsonb)
$$;--> statement-breakpoint
-- The walk rules a walk broke; what was not recorded breaks nothing.
CREATE FUNCTION "walk_rule_breaches"(p_start time, p_end time, p_temp double precision, p_sun smallint, p_wind smallint, p_rain "rain", r jsonb)
RETURNS text[] LANGUAGE sql IMMUTABLE AS $$
  SELECT array_remove(ARRAY[
    CASE WHEN (p_start IS NOT NULL AND (to_char(p_start, 'HH24:MI') < r->>'windowStart' OR to_char(p_start, 'HH24:MI') > r->>'windowEnd'))
           OR (p_end IS NOT NULL AND to_char(p_end, 'HH24:MI') > r->>'windowEnd') THEN 'outside_hours' END,
    CASE WHEN p_temp IS NOT NULL AND (p_temp < (r->>'coolMinimumC')::float8
           OR (p_temp < (r->>'warmEnoughC')::float8 AND p_sun IS NOT NULL AND p_sun < (r->>'coolSunshinePercent')::int)) THEN 'too_cool' END,
    CASE WHEN p_wind IS NOT NULL AND p_wind > (r->>'maxWindBeaufort')::int THEN 'too_windy' END,
    CASE WHEN NOT (r->>'rainAllowed')::boolean AND p_rain IN ('light', 'heavy') THEN 'rain' END
  ]::text[], NULL)
$$;--> statement-breakpoint
CREATE FUNCTION "visits_rule_breaches_set"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  NEW."rule_breaches" := walk_rule_breaches(NEW."start_time", NEW."end_time", NEW."temperature_c", NEW."sunshine_percent", NEW."wind_beaufort", NEW."rain", network_walk_rules());
  RETURN NEW;
END $$;--> statement-breakpoint
CREATE TRIGGER "visits_rule_breaches" BEFORE INSERT OR UPDATE OF "start_time", "end_time", "temperature_c", "sunshine_percent", "wind_beaufort", "rain" ON "visits"
  FOR EACH ROW EXECUTE FUNCTION "visits_rule_breaches_set"();--> statement-breakpoint
-- A sighting's warnings. "Earlier" seasons started before the walk's own season (for a walk in
-- no season: ended before its date); "checked" is accepted, read from transect_species_seasons.
CREATE FUNCTION "sighting_warning_kinds"(p_sighting uuid, p_visit uuid, p_species uuid, p_count integer)
RETURNS text[] LANGUAGE plpgsql STABLE AS $$
DECLARE
  v record;
  sp record;
  r jsonb := network_warning_rules();
  earlier_seasons integer;
  earlier_max integer;
  found_photo boolean;
  out text[] := '{}';
BEGIN
  SELECT vi."transect_id", vi."visit_date", se."starts_on" INTO v
    FROM "visits" vi LEFT JOIN "seasons" se ON se."id" = vi."season_id" WHERE vi."id" = p_visit;
  SELECT s."active_months", s."sensitive" INTO sp FROM "species" s WHERE s."id" = p_species;
  IF v IS NULL OR sp IS NULL THEN RETURN out; END IF;
  IF cardinality(sp."active_months") > 0 AND NOT (extract(month FROM v."visit_date")::smallint = ANY (sp."active_months")) THEN
    out := out || 'outside_months'::text;
  END IF;
  SELECT count(DISTINCT t."season_id"), max(t."max_count") FILTER (WHERE t."species_id" = p_species)
    INTO earlier_seasons, earlier_max
    FROM "transect_species_seasons" t JOIN "seasons" e ON e."id" = t."season_id"
    WHERE t."transect_id" = v."transect_id"
      AND CASE WHEN v."starts_on" IS NOT NULL THEN e."starts_on" < v."starts_on" ELSE e."ends_on" < v."visit_date" END;
  IF earlier_max IS NULL AND earlier_seasons >= (r->>'firstRecordMinSeasons')::int THEN
    out := out || 'first_on_transect'::text;
  END IF;
  IF earlier_max IS NOT NULL AND p_count > (r->>'countFactor')::float8 * earlier_max AND p_count >= (r->>'countMinimum')::int THEN
    out := out || 'count_above_usual'::text;
  END IF;
  IF sp."sensitive" THEN
    SELECT EXISTS (SELECT 1 FROM "photos" p WHERE p."sighting_id" = p_sighting AND p."status" <> 'refused') INTO found_photo;
    IF NOT found_photo THEN out := out || 'sensitive_no_photo'::text; END IF;
  END IF;
  RETURN out;
END $$;--> statement-breakpoint
-- Before a sighting is written: its warnings, and its revision and updated_at raised on any
-- change a person made (a write of the warnings alone, by the refreshes below, leaves both).
CREATE FUNCTION "sightings_review_columns"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'INSERT' OR (NEW."visit_id", NEW."species_id", NEW."count") IS DISTINCT FROM (OLD."visit_id", OLD."species_id", OLD."count") THEN
    NEW."warnings" := sighting_warning_kinds(NEW."id", NEW."visit_id", NEW."species_id", NEW."count");
  END IF;
  IF TG_OP = 'UPDATE' AND (NEW."visit_id", NEW."species_id", NEW."count", NEW."section", NEW."latitude", NEW."longitude", NEW."accuracy_metres", NEW."note", NEW."status")
      IS DISTINCT FROM (OLD."visit_id", OLD."species_id", OLD."count", OLD."section", OLD."latitude", OLD."longitude", OLD."accuracy_metres", OLD."note", OLD."status") THEN
    NEW."revision" := OLD."revision" + 1;
    -- The wall clock, not the transaction's start: a bulk action skips what changed after its list was read.
    NEW."updated_at" := clock_timestamp();
  END IF;
  RETURN NEW;
END $$;--> statement-breakpoint
CREATE TRIGGER "sightings_review_columns" BEFORE INSERT OR UPDATE ON "sightings" FOR EACH ROW EXECUTE FUNCTION "sightings_review_columns"();--> statement-breakpoint
-- Recomputes the warnings of the sightings these walks hold, writing only those that change.
CREATE FUNCTION "refresh_sighting_warnings"(p_visits uuid[]) RETURNS void LANGUAGE sql AS $$
  UPDATE "sightings" s SET "warnings" = w.kinds
  FROM (SELECT x."id", sighting_warning_kinds(x."id", x."visit_id", x."species_id", x."count") AS kinds
        FROM "sightings" x WHERE x."visit_id" = ANY (p_visits)) w
  WHERE s."id" = w."id" AND s."warnings" IS DISTINCT FROM w.kinds
$$;--> statement-breakpoint
-- The groups' accepted sightings summed again, then the warnings of later seasons' walks on the
-- same transects (their "earlier seasons" may have changed).
CREATE FUNCTION "refresh_transect_species_seasons"(p_transects uuid[], p_species uuid[], p_seasons uuid[]) RETURNS void LANGUAGE plpgsql AS $$
BEGIN
  IF cardinality(p_transects) = 0 THEN RETURN; END IF;
  WITH g AS (
    SELECT DISTINCT * FROM unnest(p_transects, p_species, p_seasons) AS g("transect_id", "species_id", "season_id")
  ), fresh AS (
    SELECT g."transect_id", g."species_id", g."season_id", count(s."id")::int AS n,
      coalesce(sum(s."count"), 0)::int AS total, max(s."count") AS mx
    FROM g
    LEFT JOIN "visits" v ON v."transect_id" = g."transect_id" AND v."season_id" = g."season_id"
    LEFT JOIN "sightings" s ON s."visit_id" = v."id" AND s."species_id" = g."species_id" AND s."status" = 'accepted'
    GROUP BY g."transect_id", g."species_id", g."season_id"
  ), gone AS (
    DELETE FROM "transect_species_seasons" t USING fresh f
    WHERE f.n = 0 AND (t."transect_id", t."species_id", t."season_id") = (f."transect_id", f."species_id", f."season_id")
  )
  INSERT INTO "transect_species_seasons" AS t ("transect_id", "species_id", "season_id", "sightings", "total", "max_count")
  SELECT "transect_id", "species_id", "season_id", n, total, mx FROM fresh WHERE n > 0
  ORDER BY "transect_id", "species_id", "season_id"
  ON CONFLICT ("transect_id", "species_id", "season_id") DO UPDATE SET
    "sightings" = excluded."sightings", "total" = excluded."total", "max_count" = excluded."max_count";
  PERFORM refresh_sighting_warnings(ARRAY(
    SELECT v."id" FROM "visits" v JOIN "seasons" later ON later."id" = v."season_id"
    WHERE v."transect_id" = ANY (p_transects)
      AND later."starts_on" > (SELECT min(e."starts_on") FROM "seasons" e WHERE e."id" = ANY (p_seasons))));
END $$;--> statement-breakpoint
-- Statement-level, like visit_summaries: a bulk write costs one refresh. Only rows whose status,
-- species, count or walk changed and that were or are accepted touch the summary.
CREATE FUNCTION "sightings_tss_refresh"() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  t uuid[]; sp uuid[]; se uuid[];
BEGIN
  IF TG_OP = 'INSERT' THEN
    SELECT array_agg(v."transect_id"), array_agg(r."species_id"), array_agg(v."season_id") INTO t, sp, se
    FROM (SELECT DISTINCT "visit_id", "species_id" FROM new_rows WHERE "status" = 'accepted') r
    JOIN "visits" v ON v."id" = r."visit_id" WHERE v."season_id" IS NOT NULL;
  ELSIF TG_OP = 'UPDATE' THEN
    SELECT array_agg(v."transect_id"), array_agg(r."species_id"), array_agg(v."season_id") INTO t, sp, se
    FROM (
      SELECT o."visit_id", o."species_id" FROM old_rows o JOIN new_rows n ON n."id" = o."id"
      WHERE 'accepted' IN (o."status", n."status") AND (o."status", o."species_id", o."count", o."visit_id") IS DISTINCT FROM (n."status", n."species_id", n."count", n."visit_id")
      UNION
      SELECT n."visit_id", n."species_id" FROM old_rows o JOIN new_rows n ON n."id" = o."id"
      WHERE 'accepted' IN (o."status", n."status") AND (o."status", o."species_id", o."count", o."visit_id") IS DISTINCT FROM (n."status", n."species_id", n."count", n."visit_id")
    ) r
    JOIN "visits" v ON v."id" = r."visit_id" WHERE v."season_id" IS NOT NULL;
  ELSE
    -- A walk deleted with its sightings is gone by now: visits_tss_refresh covers it.
    SELECT array_agg(v."transect_id"), array_agg(r."species_id"), array_agg(v."season_id") INTO t, sp, se
    FROM (SELECT DISTINCT "visit_id", "species_id" FROM old_rows WHERE "status" = 'accepted') r
    JOIN "visits" v ON v."id" = r."visit_id" WHERE v."season_id" IS NOT NULL;
  END IF;
  PERFORM refresh_transect_species_seasons(coalesce(t, '{}'), coalesce(sp, '{}'), coalesce(se, '{}'));
  RETURN NULL;
END $$;--> statement-breakpoint
CREATE TRIGGER "sightings_tss_insert" AFTER INSERT ON "sightings" REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION "sightings_tss_refresh"();--> statement-breakpoint
CREATE TRIGGER "sightings_tss_update" AFTER UPDATE ON "sightings" REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION "sightings_tss_refresh"();--> statement-breakpoint
CREATE TRIGGER "sightings_tss_delete" AFTER DELETE ON "sightings" REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION "sightings_tss_refresh"();--> statement-breakpoint
-- A walk moved to another season or transect, or deleted: every group of its old and new place,
-- and the warnings of its own sightings (their month and earlier seasons may have changed).
CREATE FUNCTION "visits_tss_refresh"() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  t uuid[]; sp uuid[]; se uuid[];
BEGIN
  IF TG_OP = 'UPDATE' THEN
    SELECT array_agg(g."transect_id"), array_agg(g."species_id"), array_agg(g."season_id") INTO t, sp, se FROM (
      SELECT x."transect_id", x."species_id", x."season_id" FROM "transect_species_seasons" x
      JOIN old_rows o ON o."transect_id" = x."transect_id" AND o."season_id" = x."season_id"
      JOIN new_rows n ON n."id" = o."id" AND (n."transect_id", n."season_id", n."visit_date") IS DISTINCT FROM (o."transect_id", o."season_id", o."visit_date")
      UNION
      SELECT DISTINCT n."transect_id", s."species_id", n."season_id" FROM new_rows n
      JOIN old_rows o ON o."id" = n."id" AND (n."transect_id", n."season_id", n."visit_date") IS DISTINCT FROM (o."transect_id", o."season_id", o."visit_date")
      JOIN "sightings" s ON s."visit_id" = n."id" AND s."status" = 'accepted' WHERE n."season_id" IS NOT NULL
    ) g;
    PERFORM refresh_transect_species_seasons(coalesce(t, '{}'), coalesce(sp, '{}'), coalesce(se, '{}'));
    PERFORM refresh_sighting_warnings(ARRAY(
      SELECT n."id" FROM new_rows n JOIN old_rows o ON o."id" = n."id"
      WHERE (n."transect_id", n."season_id", n."visit_date") IS DISTINCT FROM (o."transect_id", o."season_id", o."visit_date")));
  ELSE
    SELECT array_agg(x."transect_id"), array_agg(x."species_id"), array_agg(x."season_id") INTO t, sp, se
    FROM "transect_species_seasons" x JOIN (SELECT DISTINCT "transect_id", "season_id" FROM old_rows) o
      ON o."transect_id" = x."transect_id" AND o."season_id" = x."season_id";
    PERFORM refresh_transect_species_seasons(coalesce(t, '{}'), coalesce(sp, '{}'), coalesce(se, '{}'));
  END IF;
  RETURN NULL;
END $$;--> statement-breakpoint
CREATE TRIGGER "visits_tss_update" AFTER UPDATE ON "visits" REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION "visits_tss_refresh"();--> statement-breakpoint
CREATE TRIGGER "visits_tss_delete" AFTER DELETE ON "visits" REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION "visits_tss_refresh"();--> statement-breakpoint
-- A photo added, refused or removed changes "sensitive species without a photo".
CREATE FUNCTION "photos_sighting_warnings"() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  touched uuid[];
BEGIN
  -- Each statement kind has only its own transition tables: read only those.
  IF TG_OP = 'INSERT' THEN
    touched := ARRAY(SELECT "sighting_id" FROM new_rows);
  ELSIF TG_OP = 'DELETE' THEN
    touched := ARRAY(SELECT "sighting_id" FROM old_rows);
  ELSE
    touched := ARRAY(SELECT "sighting_id" FROM new_rows UNION SELECT "sighting_id" FROM old_rows);
  END IF;
  UPDATE "sightings" s SET "warnings" = sighting_warning_kinds(s."id", s."visit_id", s."species_id", s."count")
  WHERE s."id" = ANY (touched)
    AND s."warnings" IS DISTINCT FROM sighting_warning_kinds(s."id", s."visit_id", s."species_id", s."count");
  RETURN NULL;
END $$;--> statement-breakpoint
CREATE TRIGGER "photos_warnings_insert" AFTER INSERT ON "photos" REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION "photos_sighting_warnings"();--> statement-breakpoint
CREATE TRIGGER "photos_warnings_update" AFTER UPDATE ON "photos" REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION "photos_sighting_warnings"();--> statement-breakpoint
CREATE TRIGGER "photos_warnings_delete" AFTER DELETE ON "photos" REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION "photos_sighting_warnings"();--> statement-breakpoint
-- A species' usual months or sensitivity changed: its sightings' warnings again.
CREATE FUNCTION "species_sighting_warnings"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  UPDATE "sightings" s SET "warnings" = sighting_warning_kinds(s."id", s."visit_id", s."species_id", s."count")
  WHERE s."species_id" IN (SELECT n."id" FROM new_rows n JOIN old_rows o ON o."id" = n."id"
                           WHERE (n."active_months", n."sensitive") IS DISTINCT FROM (o."active_months", o."sensitive"))
    AND s."warnings" IS DISTINCT FROM sighting_warning_kinds(s."id", s."visit_id", s."species_id", s."count");
  RETURN NULL;
END $$;--> statement-breakpoint
CREATE TRIGGER "species_warnings_update" AFTER UPDATE ON "species" REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION "species_sighting_warnings"();--> statement-breakpoint
-- The audit trail is never edited, and deleted only with its sighting (a walk deleted by its
-- volunteer, an erasure): the sighting is gone before the cascade reaches its events. The one
-- edit allowed is the law's: erasing a person on request blanks the words they wrote
-- (lib/queries/personal-data.ts sets turnstone.erasing for its transaction), nothing else.
CREATE FUNCTION "verification_events_append_only"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'UPDATE' AND current_setting('turnstone.erasing', true) = 'on'
     AND (to_jsonb(NEW) - 'message') = (to_jsonb(OLD) - 'message') THEN
    RETURN NEW;
  END IF;
  IF TG_OP = 'UPDATE' OR EXISTS (SELECT 1 FROM "sightings" WHERE "id" = OLD."sighting_id") THEN
    RAISE EXCEPTION 'the review history is append-only' USING ERRCODE = 'restrict_violation';
  END IF;
  RETURN OLD;
END $$;--> statement-breakpoint
CREATE TRIGGER "verification_events_append_only" BEFORE UPDATE OR DELETE ON "verification_events" FOR EACH ROW EXECUTE FUNCTION "verification_events_append_only"();--> statement-breakpoint
-- What is already stored: the summary, then every walk's breaches and every sighting's warnings.
INSERT INTO "transect_species_seasons" ("transect_id", "species_id", "season_id", "sightings", "total", "max_count")
SELECT v."transect_id", s."species_id", v."season_id", count(*), sum(s."count"), max(s."count")
FROM "sightings" s JOIN "visits" v ON v."id" = s."visit_id"
WHERE s."status" = 'accepted' AND v."season_id" IS NOT NULL
GROUP BY 1, 2, 3;--> statement-breakpoint
UPDATE "visits" SET "rule_breaches" = walk_rule_breaches("start_time", "end_time", "temperature_c", "sunshine_percent", "wind_beaufort", "rain", network_walk_rules());--> statement-breakpoint
UPDATE "sightings" SET "warnings" = sighting_warning_kinds("id", "visit_id", "species_id", "count");
