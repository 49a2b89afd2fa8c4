CREATE TYPE "public"."import_record_status" AS ENUM('accepted', 'pending');--> statement-breakpoint
CREATE TABLE "season_imports" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"season_id" uuid NOT NULL,
	"record_status" "import_record_status" NOT NULL,
	"walks_file_name" text NOT NULL,
	"sightings_file_name" text NOT NULL,
	"content_hash" text NOT NULL,
	"walks" integer NOT NULL,
	"sightings" integer NOT NULL,
	"created_by_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "season_imports_counts" CHECK ("season_imports"."walks" >= 0 and "season_imports"."sightings" >= 0)
);
--> statement-breakpoint
CREATE TABLE "weather_misses" (
	"id" uuid PRIMARY KEY NOT NULL,
	"transect_id" uuid NOT NULL,
	"volunteer_id" uuid NOT NULL,
	"season_id" uuid NOT NULL,
	"week_start" date NOT NULL,
	"reported_on" date NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "weather_misses_monday" CHECK (extract(isodow from "weather_misses"."week_start") = 1)
);
--> statement-breakpoint
ALTER TABLE "network_settings" ADD COLUMN "season_grace_days" integer DEFAULT 30 NOT NULL;--> statement-breakpoint
ALTER TABLE "seasons" ADD COLUMN "opened_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "seasons" ADD COLUMN "closed_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "visits" ADD COLUMN "entered_by_id" uuid;--> statement-breakpoint
ALTER TABLE "visits" ADD COLUMN "import_id" uuid;--> statement-breakpoint
ALTER TABLE "season_imports" ADD CONSTRAINT "season_imports_season_id_seasons_id_fk" FOREIGN KEY ("season_id") REFERENCES "public"."seasons"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "season_imports" ADD CONSTRAINT "season_imports_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weather_misses" ADD CONSTRAINT "weather_misses_transect_id_transects_id_fk" FOREIGN KEY ("transect_id") REFERENCES "public"."transects"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weather_misses" ADD CONSTRAINT "weather_misses_volunteer_id_users_id_fk" FOREIGN KEY ("volunteer_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "weather_misses" ADD CONSTRAINT "weather_misses_season_id_seasons_id_fk" FOREIGN KEY ("season_id") REFERENCES "public"."seasons"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "season_imports_season_idx" ON "season_imports" USING btree ("season_id");--> statement-breakpoint
CREATE UNIQUE INDEX "weather_misses_week_idx" ON "weather_misses" USING btree ("transect_id","volunteer_id","week_start");--> statement-breakpoint
CREATE INDEX "weather_misses_season_idx" ON "weather_misses" USING btree ("season_id","transect_id");--> statement-breakpoint
ALTER TABLE "visits" ADD CONSTRAINT "visits_entered_by_id_users_id_fk" FOREIGN KEY ("entered_by_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "visits" ADD CONSTRAINT "visits_import_id_season_imports_id_fk" FOREIGN KEY ("import_id") REFERENCES "public"."season_imports"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "visits_import_idx" ON "visits" USING btree ("import_id");--> statement-breakpoint
ALTER TABLE "network_settings" ADD CONSTRAINT "network_settings_grace_days" CHECK ("network_settings"."season_grace_days" between 0 and 365);--> statement-breakpoint
-- Seasons closed before this migration are taken as closed the day after they ended; open and
-- closed ones as opened on their first day.
UPDATE "seasons" SET "closed_at" = ("ends_on" + 1)::timestamptz WHERE "status" = 'closed';--> statement-breakpoint
UPDATE "seasons" SET "opened_at" = "starts_on"::timestamptz WHERE "status" <> 'planning';--> statement-breakpoint
-- Seasons never overlap (hand-written: drizzle-kit does not model EXCLUDE).
ALTER TABLE "seasons" ADD CONSTRAINT "seasons_no_overlap" EXCLUDE USING gist (daterange("starts_on", "ends_on", '[]') WITH &&);--> statement-breakpoint
ALTER TABLE "seasons" ADD CONSTRAINT "seasons_closed_has_date" CHECK (("seasons"."status" = 'closed') = ("seasons"."closed_at" is not null));