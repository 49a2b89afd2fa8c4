CREATE TABLE "species_aggregate_members" (
	"aggregate_id" uuid NOT NULL,
	"member_id" uuid NOT NULL,
	CONSTRAINT "species_aggregate_members_aggregate_id_member_id_pk" PRIMARY KEY("aggregate_id","member_id"),
	CONSTRAINT "species_aggregate_members_distinct" CHECK ("species_aggregate_members"."aggregate_id" <> "species_aggregate_members"."member_id")
);
--> statement-breakpoint
CREATE TABLE "species_merges" (
	"from_species_id" uuid PRIMARY KEY NOT NULL,
	"from_scientific_name" text NOT NULL,
	"into_species_id" uuid NOT NULL,
	"merged_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "species_synonyms" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"species_id" uuid NOT NULL,
	"name" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "transect_route_versions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"transect_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"valid_from" date NOT NULL,
	"route" jsonb NOT NULL,
	"section_count" integer NOT NULL,
	"length_metres" integer NOT NULL,
	"created_by_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "transect_route_versions_number_positive" CHECK ("transect_route_versions"."version" >= 1),
	CONSTRAINT "transect_route_versions_sections" CHECK ("transect_route_versions"."section_count" between 1 and 50),
	CONSTRAINT "transect_route_versions_length_positive" CHECK ("transect_route_versions"."length_metres" > 0),
	CONSTRAINT "transect_route_versions_linestring" CHECK ("transect_route_versions"."route"->>'type' = 'LineString' and jsonb_array_length("transect_route_versions"."route"->'coordinates') >= 2)
);
--> statement-breakpoint
CREATE TABLE "transect_sections" (
	"version_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"from_point" integer NOT NULL,
	"to_point" integer NOT NULL,
	"length_metres" integer NOT NULL,
	"habitat" text,
	CONSTRAINT "transect_sections_version_id_number_pk" PRIMARY KEY("version_id","number"),
	CONSTRAINT "transect_sections_number" CHECK ("transect_sections"."number" between 1 and 50),
	CONSTRAINT "transect_sections_points" CHECK ("transect_sections"."from_point" >= 0 and "transect_sections"."to_point" > "transect_sections"."from_point"),
	CONSTRAINT "transect_sections_length" CHECK ("transect_sections"."length_metres" >= 0)
);
--> statement-breakpoint
ALTER TABLE "habitat_groups" ADD COLUMN "colour" text DEFAULT 'slate' NOT NULL;--> statement-breakpoint
ALTER TABLE "transects" ADD COLUMN "sensitive" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "transects" ADD COLUMN "retired_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "species_aggregate_members" ADD CONSTRAINT "species_aggregate_members_aggregate_id_species_id_fk" FOREIGN KEY ("aggregate_id") REFERENCES "public"."species"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "species_aggregate_members" ADD CONSTRAINT "species_aggregate_members_member_id_species_id_fk" FOREIGN KEY ("member_id") REFERENCES "public"."species"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "species_merges" ADD CONSTRAINT "species_merges_into_species_id_species_id_fk" FOREIGN KEY ("into_species_id") REFERENCES "public"."species"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "species_synonyms" ADD CONSTRAINT "species_synonyms_species_id_species_id_fk" FOREIGN KEY ("species_id") REFERENCES "public"."species"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "transect_route_versions" ADD CONSTRAINT "transect_route_versions_transect_id_transects_id_fk" FOREIGN KEY ("transect_id") REFERENCES "public"."transects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "transect_route_versions" ADD CONSTRAINT "transect_route_versions_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "transect_sections" ADD CONSTRAINT "transect_sections_version_id_transect_route_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."transect_route_versions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "species_aggregate_members_member_idx" ON "species_aggregate_members" USING btree ("member_id");--> statement-breakpoint
CREATE INDEX "species_merges_into_idx" ON "species_merges" USING btree ("into_species_id");--> statement-breakpoint
CREATE UNIQUE INDEX "species_synonyms_name_idx" ON "species_synonyms" USING btree (lower("name"));--> statement-breakpoint
CREATE INDEX "species_synonyms_species_idx" ON "species_synonyms" USING btree ("species_id");--> statement-breakpoint
CREATE UNIQUE INDEX "transect_route_versions_number_idx" ON "transect_route_versions" USING btree ("transect_id","version");--> statement-breakpoint
CREATE UNIQUE INDEX "transect_route_versions_from_idx" ON "transect_route_versions" USING btree ("transect_id","valid_from");--> statement-breakpoint
CREATE UNIQUE INDEX "species_tags_label_idx" ON "species_tags" USING btree (lower("label"));--> statement-breakpoint
CREATE UNIQUE INDEX "habitat_groups_name_lower_idx" ON "habitat_groups" USING btree (lower("name"));--> statement-breakpoint
ALTER TABLE "habitat_groups" ADD CONSTRAINT "habitat_groups_colour_key" CHECK ("habitat_groups"."colour" ~ '^[a-z]{1,32}$');