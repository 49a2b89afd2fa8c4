CREATE TYPE "public"."role" AS ENUM('volunteer', 'coordinator', 'organiser', 'partner');--> statement-breakpoint
CREATE TYPE "public"."taxon_rank" AS ENUM('species', 'subspecies', 'species_aggregate', 'genus', 'family', 'other');--> statement-breakpoint
CREATE TYPE "public"."season_status" AS ENUM('planning', 'open', 'closed');--> statement-breakpoint
CREATE TYPE "public"."photo_status" AS ENUM('awaiting_upload', 'processing', 'ready', 'refused');--> statement-breakpoint
CREATE TYPE "public"."sighting_status" AS ENUM('pending', 'accepted', 'queried', 'rejected');--> statement-breakpoint
CREATE TYPE "public"."sky" AS ENUM('clear', 'mostly_sunny', 'broken_cloud', 'mostly_cloudy', 'overcast');--> statement-breakpoint
CREATE TYPE "public"."review_action" AS ENUM('accept', 'query', 'reject', 'reopen', 'reply', 'edit');--> statement-breakpoint
CREATE TYPE "public"."abundance_summary" AS ENUM('sum', 'max', 'mean');--> statement-breakpoint
CREATE TYPE "public"."change_direction" AS ENUM('gain', 'loss', 'none');--> statement-breakpoint
CREATE TYPE "public"."dissimilarity_index" AS ENUM('jaccard', 'sorensen', 'ruzicka', 'percentage-difference');--> statement-breakpoint
CREATE TYPE "public"."effort_matching" AS ENUM('none', 'random-subsample', 'earliest');--> statement-breakpoint
CREATE TYPE "public"."p_adjust" AS ENUM('holm', 'bh', 'bonferroni', 'none');--> statement-breakpoint
CREATE TYPE "public"."permutation_mode" AS ENUM('paired', 'independent');--> statement-breakpoint
CREATE TYPE "public"."run_status" AS ENUM('queued', 'running', 'finished', 'failed', 'cancelled');--> statement-breakpoint
CREATE TYPE "public"."email_status" AS ENUM('queued', 'sending', 'sent', 'failed');--> statement-breakpoint
CREATE TYPE "public"."export_format" AS ENUM('darwin-core-archive', 'occurrence-csv', 'site-by-species-csv', 'change-results-csv', 'geojson');--> statement-breakpoint
CREATE TYPE "public"."newsletter_status" AS ENUM('draft', 'queued', 'sent');--> statement-breakpoint
CREATE TABLE "invitations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"email" text NOT NULL,
	"name" text NOT NULL,
	"role" "role" NOT NULL,
	"token_hash" text NOT NULL,
	"invited_by_id" uuid NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"accepted_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "network_settings" (
	"id" integer PRIMARY KEY DEFAULT 1 NOT NULL,
	"name" text NOT NULL,
	"taxon_group" text NOT NULL,
	"min_temperature_c" integer,
	"max_wind_beaufort" integer,
	"earliest_start_time" text,
	"latest_start_time" text,
	"contact_email" text,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "network_settings_singleton" CHECK ("network_settings"."id" = 1),
	CONSTRAINT "network_settings_wind" CHECK ("network_settings"."max_wind_beaufort" is null or "network_settings"."max_wind_beaufort" between 0 and 12)
);
--> statement-breakpoint
CREATE TABLE "sign_in_attempts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"email_key" text NOT NULL,
	"ip_key" text NOT NULL,
	"succeeded" boolean NOT NULL,
	"attempted_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "users" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"email" text NOT NULL,
	"name" text NOT NULL,
	"role" "role" DEFAULT 'volunteer' NOT NULL,
	"password_hash" text,
	"active" boolean DEFAULT true NOT NULL,
	"invited_by_id" uuid,
	"accepted_safety_at" timestamp with time zone,
	"last_sign_in_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "users_email_shape" CHECK ("users"."email" ~ '^[^@\s]+@[^@\s]+$')
);
--> statement-breakpoint
CREATE TABLE "species" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"scientific_name" text NOT NULL,
	"vernacular_name" text NOT NULL,
	"taxon_rank" "taxon_rank" DEFAULT 'species' NOT NULL,
	"taxon_group" text NOT NULL,
	"sensitive" boolean DEFAULT false NOT NULL,
	"active_months" smallint[] DEFAULT '{}'::smallint[] NOT NULL,
	"sort_order" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "species_active_months_range" CHECK ("species"."active_months" <@ '{1,2,3,4,5,6,7,8,9,10,11,12}'::smallint[])
);
--> statement-breakpoint
CREATE TABLE "species_tag_links" (
	"species_id" uuid NOT NULL,
	"tag_id" uuid NOT NULL,
	CONSTRAINT "species_tag_links_species_id_tag_id_pk" PRIMARY KEY("species_id","tag_id")
);
--> statement-breakpoint
CREATE TABLE "species_tags" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"slug" text NOT NULL,
	"label" text NOT NULL,
	"description" text,
	CONSTRAINT "species_tags_slug_unique" UNIQUE("slug")
);
--> statement-breakpoint
CREATE TABLE "habitat_groups" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"code" text NOT NULL,
	"name" text NOT NULL,
	"description" text,
	CONSTRAINT "habitat_groups_code_unique" UNIQUE("code")
);
--> statement-breakpoint
CREATE TABLE "seasons" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"starts_on" date NOT NULL,
	"ends_on" date NOT NULL,
	"status" "season_status" DEFAULT 'planning' NOT NULL,
	"min_visits" integer DEFAULT 1 NOT NULL,
	"target_visits" integer DEFAULT 6 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "seasons_name_unique" UNIQUE("name"),
	CONSTRAINT "seasons_dates_ordered" CHECK ("seasons"."ends_on" >= "seasons"."starts_on"),
	CONSTRAINT "seasons_min_visits" CHECK ("seasons"."min_visits" >= 1),
	CONSTRAINT "seasons_target_visits" CHECK ("seasons"."target_visits" >= 1)
);
--> statement-breakpoint
CREATE TABLE "transect_assignments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"transect_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"assigned_by_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "transects" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"code" text NOT NULL,
	"name" text NOT NULL,
	"habitat_group_id" uuid NOT NULL,
	"route" jsonb NOT NULL,
	"section_count" integer NOT NULL,
	"length_metres" integer NOT NULL,
	"access_notes" text,
	"coastal" boolean DEFAULT false NOT NULL,
	"active" boolean DEFAULT true NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "transects_code_unique" UNIQUE("code"),
	CONSTRAINT "transects_sections_positive" CHECK ("transects"."section_count" between 1 and 50),
	CONSTRAINT "transects_length_positive" CHECK ("transects"."length_metres" > 0),
	CONSTRAINT "transects_route_linestring" CHECK ("transects"."route"->>'type' = 'LineString' and jsonb_array_length("transects"."route"->'coordinates') >= 2)
);
--> statement-breakpoint
CREATE TABLE "photos" (
	"id" uuid PRIMARY KEY NOT NULL,
	"sighting_id" uuid,
	"visit_id" uuid NOT NULL,
	"uploaded_by_id" uuid NOT NULL,
	"status" "photo_status" DEFAULT 'awaiting_upload' NOT NULL,
	"upload_key" text NOT NULL,
	"display_key" text,
	"thumbnail_key" text,
	"content_type" text,
	"bytes" integer,
	"width" integer,
	"height" integer,
	"refusal_reason" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"processed_at" timestamp with time zone,
	CONSTRAINT "photos_bytes_nonnegative" CHECK ("photos"."bytes" is null or "photos"."bytes" >= 0)
);
--> statement-breakpoint
CREATE TABLE "sightings" (
	"id" uuid PRIMARY KEY NOT NULL,
	"visit_id" uuid NOT NULL,
	"species_id" uuid NOT NULL,
	"count" integer DEFAULT 1 NOT NULL,
	"section" smallint,
	"latitude" double precision,
	"longitude" double precision,
	"accuracy_metres" double precision,
	"note" text,
	"status" "sighting_status" DEFAULT 'pending' NOT NULL,
	"reviewed_by_id" uuid,
	"reviewed_at" timestamp with time zone,
	"client_updated_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "sightings_count_nonnegative" CHECK ("sightings"."count" >= 0),
	CONSTRAINT "sightings_section_positive" CHECK ("sightings"."section" is null or "sightings"."section" >= 1),
	CONSTRAINT "sightings_latitude" CHECK ("sightings"."latitude" is null or "sightings"."latitude" between -90 and 90),
	CONSTRAINT "sightings_longitude" CHECK ("sightings"."longitude" is null or "sightings"."longitude" between -180 and 180),
	CONSTRAINT "sightings_position_pair" CHECK (("sightings"."latitude" is null) = ("sightings"."longitude" is null))
);
--> statement-breakpoint
CREATE TABLE "visits" (
	"id" uuid PRIMARY KEY NOT NULL,
	"transect_id" uuid NOT NULL,
	"volunteer_id" uuid NOT NULL,
	"season_id" uuid,
	"visit_date" date NOT NULL,
	"start_time" time NOT NULL,
	"end_time" time,
	"temperature_c" double precision,
	"wind_beaufort" smallint,
	"cloud_cover_percent" smallint,
	"sky" "sky",
	"co_recorders" text,
	"complete_list" boolean DEFAULT false NOT NULL,
	"notes" text,
	"submitted_at" timestamp with time zone,
	"client_updated_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "visits_wind_beaufort" CHECK ("visits"."wind_beaufort" is null or "visits"."wind_beaufort" between 0 and 12),
	CONSTRAINT "visits_cloud_percent" CHECK ("visits"."cloud_cover_percent" is null or "visits"."cloud_cover_percent" between 0 and 100),
	CONSTRAINT "visits_temperature_plausible" CHECK ("visits"."temperature_c" is null or "visits"."temperature_c" between -40 and 60),
	CONSTRAINT "visits_times_ordered" CHECK ("visits"."end_time" is null or "visits"."end_time" >= "visits"."start_time")
);
--> statement-breakpoint
CREATE TABLE "verification_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"sighting_id" uuid NOT NULL,
	"actor_id" uuid NOT NULL,
	"action" "review_action" NOT NULL,
	"from_status" "sighting_status",
	"to_status" "sighting_status",
	"message" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "analysis_chunks" (
	"run_id" uuid NOT NULL,
	"chunk_index" integer NOT NULL,
	"permutations" integer NOT NULL,
	"counts" jsonb,
	"finished_at" timestamp with time zone,
	CONSTRAINT "analysis_chunks_run_id_chunk_index_pk" PRIMARY KEY("run_id","chunk_index")
);
--> statement-breakpoint
CREATE TABLE "analysis_exclusions" (
	"run_id" uuid NOT NULL,
	"transect_id" uuid NOT NULL,
	"reason" text NOT NULL,
	CONSTRAINT "analysis_exclusions_run_id_transect_id_pk" PRIMARY KEY("run_id","transect_id")
);
--> statement-breakpoint
CREATE TABLE "analysis_runs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"requested_by_id" uuid,
	"baseline_season_id" uuid NOT NULL,
	"comparison_season_id" uuid NOT NULL,
	"dissimilarity_index" "dissimilarity_index" DEFAULT 'percentage-difference' NOT NULL,
	"mode" "permutation_mode" DEFAULT 'paired' NOT NULL,
	"permutations" integer DEFAULT 9999 NOT NULL,
	"seed" integer DEFAULT 1 NOT NULL,
	"adjust" "p_adjust" DEFAULT 'holm' NOT NULL,
	"alpha" double precision DEFAULT 0.05 NOT NULL,
	"abundance_summary" "abundance_summary" DEFAULT 'sum' NOT NULL,
	"min_visits" integer DEFAULT 1 NOT NULL,
	"effort_matching" "effort_matching" DEFAULT 'none' NOT NULL,
	"species_tag_id" uuid,
	"nightly" boolean DEFAULT false NOT NULL,
	"status" "run_status" DEFAULT 'queued' NOT NULL,
	"chunks_total" integer DEFAULT 0 NOT NULL,
	"chunks_done" integer DEFAULT 0 NOT NULL,
	"summary" jsonb,
	"failure_reason" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone,
	CONSTRAINT "analysis_runs_distinct_seasons" CHECK ("analysis_runs"."baseline_season_id" <> "analysis_runs"."comparison_season_id"),
	CONSTRAINT "analysis_runs_permutations" CHECK ("analysis_runs"."permutations" between 0 and 999999),
	CONSTRAINT "analysis_runs_alpha" CHECK ("analysis_runs"."alpha" > 0 and "analysis_runs"."alpha" < 1),
	CONSTRAINT "analysis_runs_min_visits" CHECK ("analysis_runs"."min_visits" >= 1)
);
--> statement-breakpoint
CREATE TABLE "analysis_site_results" (
	"run_id" uuid NOT NULL,
	"transect_id" uuid NOT NULL,
	"shared" double precision NOT NULL,
	"lost" double precision NOT NULL,
	"gained" double precision NOT NULL,
	"losses" double precision NOT NULL,
	"gains" double precision NOT NULL,
	"dissimilarity" double precision NOT NULL,
	"direction" "change_direction" NOT NULL,
	"p" double precision,
	"p_adjusted" double precision,
	"exceptional" boolean DEFAULT false NOT NULL,
	"species_lost" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"species_gained" jsonb DEFAULT '[]'::jsonb NOT NULL,
	CONSTRAINT "analysis_site_results_run_id_transect_id_pk" PRIMARY KEY("run_id","transect_id"),
	CONSTRAINT "analysis_site_results_d_range" CHECK ("analysis_site_results"."dissimilarity" between 0 and 1),
	CONSTRAINT "analysis_site_results_p_range" CHECK ("analysis_site_results"."p" is null or ("analysis_site_results"."p" > 0 and "analysis_site_results"."p" <= 1))
);
--> statement-breakpoint
CREATE TABLE "email_outbox" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"to_address" text NOT NULL,
	"subject" text NOT NULL,
	"text_body" text NOT NULL,
	"html_body" text,
	"purpose" text NOT NULL,
	"newsletter_id" uuid,
	"status" "email_status" DEFAULT 'queued' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"last_error" text,
	"send_after" timestamp with time zone DEFAULT now() NOT NULL,
	"sent_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "email_outbox_attempts" CHECK ("email_outbox"."attempts" >= 0)
);
--> statement-breakpoint
CREATE TABLE "export_log" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"requested_by_id" uuid,
	"format" "export_format" NOT NULL,
	"parameters" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"row_count" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "newsletters" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"title" text NOT NULL,
	"body" text NOT NULL,
	"analysis_run_id" uuid,
	"created_by_id" uuid,
	"status" "newsletter_status" DEFAULT 'draft' NOT NULL,
	"sent_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_invited_by_id_users_id_fk" FOREIGN KEY ("invited_by_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "species_tag_links" ADD CONSTRAINT "species_tag_links_species_id_species_id_fk" FOREIGN KEY ("species_id") REFERENCES "public"."species"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "species_tag_links" ADD CONSTRAINT "species_tag_links_tag_id_species_tags_id_fk" FOREIGN KEY ("tag_id") REFERENCES "public"."species_tags"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "transect_assignments" ADD CONSTRAINT "transect_assignments_transect_id_transects_id_fk" FOREIGN KEY ("transect_id") REFERENCES "public"."transects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "transect_assignments" ADD CONSTRAINT "transect_assignments_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "transect_assignments" ADD CONSTRAINT "transect_assignments_assigned_by_id_users_id_fk" FOREIGN KEY ("assigned_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "transects" ADD CONSTRAINT "transects_habitat_group_id_habitat_groups_id_fk" FOREIGN KEY ("habitat_group_id") REFERENCES "public"."habitat_groups"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_sighting_id_sightings_id_fk" FOREIGN KEY ("sighting_id") REFERENCES "public"."sightings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_visit_id_visits_id_fk" FOREIGN KEY ("visit_id") REFERENCES "public"."visits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_uploaded_by_id_users_id_fk" FOREIGN KEY ("uploaded_by_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sightings" ADD CONSTRAINT "sightings_visit_id_visits_id_fk" FOREIGN KEY ("visit_id") REFERENCES "public"."visits"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sightings" ADD CONSTRAINT "sightings_species_id_species_id_fk" FOREIGN KEY ("species_id") REFERENCES "public"."species"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sightings" ADD CONSTRAINT "sightings_reviewed_by_id_users_id_fk" FOREIGN KEY ("reviewed_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "visits" ADD CONSTRAINT "visits_transect_id_transects_id_fk" FOREIGN KEY ("transect_id") REFERENCES "public"."transects"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "visits" ADD CONSTRAINT "visits_volunteer_id_users_id_fk" FOREIGN KEY ("volunteer_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "visits" ADD CONSTRAINT "visits_season_id_seasons_id_fk" FOREIGN KEY ("season_id") REFERENCES "public"."seasons"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "verification_events" ADD CONSTRAINT "verification_events_sighting_id_sightings_id_fk" FOREIGN KEY ("sighting_id") REFERENCES "public"."sightings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "verification_events" ADD CONSTRAINT "verification_events_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analysis_chunks" ADD CONSTRAINT "analysis_chunks_run_id_analysis_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."analysis_runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analysis_exclusions" ADD CONSTRAINT "analysis_exclusions_run_id_analysis_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."analysis_runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analysis_exclusions" ADD CONSTRAINT "analysis_exclusions_transect_id_transects_id_fk" FOREIGN KEY ("transect_id") REFERENCES "public"."transects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analysis_runs" ADD CONSTRAINT "analysis_runs_requested_by_id_users_id_fk" FOREIGN KEY ("requested_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analysis_runs" ADD CONSTRAINT "analysis_runs_baseline_season_id_seasons_id_fk" FOREIGN KEY ("baseline_season_id") REFERENCES "public"."seasons"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analysis_runs" ADD CONSTRAINT "analysis_runs_comparison_season_id_seasons_id_fk" FOREIGN KEY ("comparison_season_id") REFERENCES "public"."seasons"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analysis_runs" ADD CONSTRAINT "analysis_runs_species_tag_id_species_tags_id_fk" FOREIGN KEY ("species_tag_id") REFERENCES "public"."species_tags"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analysis_site_results" ADD CONSTRAINT "analysis_site_results_run_id_analysis_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."analysis_runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analysis_site_results" ADD CONSTRAINT "analysis_site_results_transect_id_transects_id_fk" FOREIGN KEY ("transect_id") REFERENCES "public"."transects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "export_log" ADD CONSTRAINT "export_log_requested_by_id_users_id_fk" FOREIGN KEY ("requested_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "newsletters" ADD CONSTRAINT "newsletters_analysis_run_id_analysis_runs_id_fk" FOREIGN KEY ("analysis_run_id") REFERENCES "public"."analysis_runs"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "newsletters" ADD CONSTRAINT "newsletters_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "invitations_token_hash_idx" ON "invitations" USING btree ("token_hash");--> statement-breakpoint
CREATE INDEX "invitations_email_idx" ON "invitations" USING btree (lower("email"));--> statement-breakpoint
CREATE INDEX "sign_in_attempts_email_idx" ON "sign_in_attempts" USING btree ("email_key","attempted_at");--> statement-breakpoint
CREATE INDEX "sign_in_attempts_ip_idx" ON "sign_in_attempts" USING btree ("ip_key","attempted_at");--> statement-breakpoint
CREATE UNIQUE INDEX "users_email_lower_idx" ON "users" USING btree (lower("email"));--> statement-breakpoint
CREATE INDEX "users_role_idx" ON "users" USING btree ("role");--> statement-breakpoint
CREATE UNIQUE INDEX "species_scientific_name_idx" ON "species" USING btree (lower("scientific_name"));--> statement-breakpoint
CREATE INDEX "species_vernacular_idx" ON "species" USING btree ("vernacular_name");--> statement-breakpoint
CREATE INDEX "species_tag_links_tag_idx" ON "species_tag_links" USING btree ("tag_id");--> statement-breakpoint
CREATE UNIQUE INDEX "transect_assignments_pair_idx" ON "transect_assignments" USING btree ("transect_id","user_id");--> statement-breakpoint
CREATE INDEX "transect_assignments_user_idx" ON "transect_assignments" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "transects_habitat_idx" ON "transects" USING btree ("habitat_group_id");--> statement-breakpoint
CREATE INDEX "photos_sighting_idx" ON "photos" USING btree ("sighting_id");--> statement-breakpoint
CREATE INDEX "photos_visit_idx" ON "photos" USING btree ("visit_id");--> statement-breakpoint
CREATE INDEX "sightings_visit_idx" ON "sightings" USING btree ("visit_id");--> statement-breakpoint
CREATE INDEX "sightings_species_idx" ON "sightings" USING btree ("species_id");--> statement-breakpoint
CREATE INDEX "sightings_status_idx" ON "sightings" USING btree ("status");--> statement-breakpoint
CREATE INDEX "visits_transect_date_idx" ON "visits" USING btree ("transect_id","visit_date");--> statement-breakpoint
CREATE INDEX "visits_volunteer_idx" ON "visits" USING btree ("volunteer_id","visit_date");--> statement-breakpoint
CREATE INDEX "visits_season_idx" ON "visits" USING btree ("season_id");--> statement-breakpoint
CREATE INDEX "verification_events_sighting_idx" ON "verification_events" USING btree ("sighting_id","created_at");--> statement-breakpoint
CREATE INDEX "analysis_runs_seasons_idx" ON "analysis_runs" USING btree ("baseline_season_id","comparison_season_id","created_at");--> statement-breakpoint
CREATE INDEX "email_outbox_due_idx" ON "email_outbox" USING btree ("status","send_after");--> statement-breakpoint
CREATE INDEX "export_log_requested_idx" ON "export_log" USING btree ("requested_by_id","created_at");