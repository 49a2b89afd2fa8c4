CREATE TABLE "visit_summaries" (
	"visit_id" uuid PRIMARY KEY NOT NULL,
	"pending" integer DEFAULT 0 NOT NULL,
	"queried" integer DEFAULT 0 NOT NULL,
	"accepted" integer DEFAULT 0 NOT NULL,
	"rejected" integer DEFAULT 0 NOT NULL
);
--> statement-breakpoint
DROP INDEX "network_changes_created_idx";--> statement-breakpoint
DROP INDEX "network_changes_entity_idx";--> statement-breakpoint
ALTER TABLE "visit_summaries" ADD CONSTRAINT "visit_summaries_visit_id_visits_id_fk" FOREIGN KEY ("visit_id") REFERENCES "public"."visits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "network_changes_entity_time_idx" ON "network_changes" USING btree ("entity","created_at","id");--> statement-breakpoint
CREATE INDEX "network_changes_created_idx" ON "network_changes" USING btree ("created_at","id");--> statement-breakpoint
CREATE INDEX "network_changes_entity_idx" ON "network_changes" USING btree ("entity","entity_id","created_at","id");
--> statement-breakpoint
-- Hand-written: the triggers that keep visit_summaries equal to counting each walk's sightings by
-- status. Statement-level with transition tables, so a bulk write (an import of 100,000 rows, a
-- merge re-pointing every sighting of a species) costs one grouped upsert, not a trigger per row.
-- An INSERT ... ON CONFLICT DO UPDATE (the sync) fires the INSERT trigger with the rows it
-- inserted and the UPDATE trigger with the rows it updated. Upserts go in visit order, so two
-- transactions touching the same walks lock their rows in the same order.
CREATE FUNCTION "visit_summaries_count"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP = 'INSERT' THEN
    INSERT INTO "visit_summaries" AS s ("visit_id", "pending", "queried", "accepted", "rejected")
    SELECT "visit_id",
      count(*) FILTER (WHERE "status" = 'pending'), count(*) FILTER (WHERE "status" = 'queried'),
      count(*) FILTER (WHERE "status" = 'accepted'), count(*) FILTER (WHERE "status" = 'rejected')
    FROM new_rows GROUP BY "visit_id" ORDER BY "visit_id"
    ON CONFLICT ("visit_id") DO UPDATE SET
      "pending" = s."pending" + excluded."pending", "queried" = s."queried" + excluded."queried",
      "accepted" = s."accepted" + excluded."accepted", "rejected" = s."rejected" + excluded."rejected";
  ELSIF TG_OP = 'UPDATE' THEN
    -- A status change or a sighting moved to another walk: what the old rows counted comes off,
    -- what the new rows count goes on; a walk whose counts do not change is not touched.
    INSERT INTO "visit_summaries" AS s ("visit_id", "pending", "queried", "accepted", "rejected")
    SELECT "visit_id", "pending", "queried", "accepted", "rejected"
    FROM (
      SELECT "visit_id",
        coalesce(sum(n) FILTER (WHERE "status" = 'pending'), 0)::int AS "pending",
        coalesce(sum(n) FILTER (WHERE "status" = 'queried'), 0)::int AS "queried",
        coalesce(sum(n) FILTER (WHERE "status" = 'accepted'), 0)::int AS "accepted",
        coalesce(sum(n) FILTER (WHERE "status" = 'rejected'), 0)::int AS "rejected"
      FROM (
        SELECT "visit_id", "status", 1 AS n FROM new_rows
        UNION ALL
        SELECT "visit_id", "status", -1 AS n FROM old_rows
      ) moves
      GROUP BY "visit_id"
    ) d
    WHERE ("pending", "queried", "accepted", "rejected") <> (0, 0, 0, 0)
    ORDER BY "visit_id"
    ON CONFLICT ("visit_id") DO UPDATE SET
      "pending" = s."pending" + excluded."pending", "queried" = s."queried" + excluded."queried",
      "accepted" = s."accepted" + excluded."accepted", "rejected" = s."rejected" + excluded."rejected";
  ELSIF TG_OP = 'DELETE' THEN
    -- Only ever lowers rows that exist; when the walk itself is being deleted its row goes by the
    -- foreign key's cascade, before or after this.
    UPDATE "visit_summaries" s SET
      "pending" = s."pending" - d."pending", "queried" = s."queried" - d."queried",
      "accepted" = s."accepted" - d."accepted", "rejected" = s."rejected" - d."rejected"
    FROM (
      SELECT "visit_id",
        count(*) FILTER (WHERE "status" = 'pending')::int AS "pending", count(*) FILTER (WHERE "status" = 'queried')::int AS "queried",
        count(*) FILTER (WHERE "status" = 'accepted')::int AS "accepted", count(*) FILTER (WHERE "status" = 'rejected')::int AS "rejected"
      FROM old_rows GROUP BY "visit_id"
    ) d
    WHERE s."visit_id" = d."visit_id";
  ELSE
    DELETE FROM "visit_summaries";
  END IF;
  RETURN NULL;
END
$$;--> statement-breakpoint
CREATE TRIGGER "sightings_summary_insert" AFTER INSERT ON "sightings" REFERENCING NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION "visit_summaries_count"();--> statement-breakpoint
CREATE TRIGGER "sightings_summary_update" AFTER UPDATE ON "sightings" REFERENCING OLD TABLE AS old_rows NEW TABLE AS new_rows FOR EACH STATEMENT EXECUTE FUNCTION "visit_summaries_count"();--> statement-breakpoint
CREATE TRIGGER "sightings_summary_delete" AFTER DELETE ON "sightings" REFERENCING OLD TABLE AS old_rows FOR EACH STATEMENT EXECUTE FUNCTION "visit_summaries_count"();--> statement-breakpoint
CREATE TRIGGER "sightings_summary_truncate" AFTER TRUNCATE ON "sightings" FOR EACH STATEMENT EXECUTE FUNCTION "visit_summaries_count"();--> statement-breakpoint
-- The walks recorded before this migration.
INSERT INTO "visit_summaries" ("visit_id", "pending", "queried", "accepted", "rejected")
SELECT "visit_id",
  count(*) FILTER (WHERE "status" = 'pending'), count(*) FILTER (WHERE "status" = 'queried'),
  count(*) FILTER (WHERE "status" = 'accepted'), count(*) FILTER (WHERE "status" = 'rejected')
FROM "sightings" GROUP BY "visit_id";
