CREATE TYPE "public"."network_entity" AS ENUM('transect', 'habitat_group', 'species', 'species_tag', 'season', 'person', 'assignment', 'agreement', 'settings', 'import');--> statement-breakpoint
CREATE TABLE "network_changes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"actor_id" uuid,
	"entity" "network_entity" NOT NULL,
	"entity_id" text,
	"action" text NOT NULL,
	"summary" text NOT NULL,
	"before" jsonb,
	"after" jsonb,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "network_changes" ADD CONSTRAINT "network_changes_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "network_changes_created_idx" ON "network_changes" USING btree ("created_at" DESC NULLS LAST,"id");--> statement-breakpoint
CREATE INDEX "network_changes_entity_idx" ON "network_changes" USING btree ("entity","entity_id","created_at");