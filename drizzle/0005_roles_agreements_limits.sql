CREATE TYPE "public"."record_licence" AS ENUM('CC0-1.0', 'CC-BY-4.0', 'CC-BY-NC-4.0');--> statement-breakpoint
CREATE TABLE "agreement_acceptances" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"publish_name" boolean NOT NULL,
	"newsletter" boolean NOT NULL,
	"accepted_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "recorder_agreements" (
	"version" integer PRIMARY KEY NOT NULL,
	"body" text NOT NULL,
	"licence" "record_licence" NOT NULL,
	"created_by_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "recorder_agreements_version_positive" CHECK ("recorder_agreements"."version" >= 1)
);
--> statement-breakpoint
ALTER TABLE "analysis_runs" DROP CONSTRAINT "analysis_runs_permutations";--> statement-breakpoint
DROP INDEX "users_role_idx";--> statement-breakpoint
ALTER TABLE "invitations" ADD COLUMN "roles" "role"[];--> statement-breakpoint
-- Each person's and invitation's one role becomes their list of roles (written by hand: drizzle-kit drops and adds).
UPDATE "invitations" SET "roles" = ARRAY["role"];--> statement-breakpoint
ALTER TABLE "invitations" ALTER COLUMN "roles" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "roles" "role"[] DEFAULT '{volunteer}'::role[] NOT NULL;--> statement-breakpoint
UPDATE "users" SET "roles" = ARRAY["role"];--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "pseudonym" text DEFAULT 'Recorder ' || upper(left(gen_random_uuid()::text, 8)) NOT NULL;--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "publish_name" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "newsletter" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "erased_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "agreement_acceptances" ADD CONSTRAINT "agreement_acceptances_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "agreement_acceptances" ADD CONSTRAINT "agreement_acceptances_version_recorder_agreements_version_fk" FOREIGN KEY ("version") REFERENCES "public"."recorder_agreements"("version") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recorder_agreements" ADD CONSTRAINT "recorder_agreements_created_by_id_users_id_fk" FOREIGN KEY ("created_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "agreement_acceptances_user_idx" ON "agreement_acceptances" USING btree ("user_id","version");--> statement-breakpoint
CREATE UNIQUE INDEX "users_pseudonym_idx" ON "users" USING btree ("pseudonym");--> statement-breakpoint
CREATE INDEX "users_roles_idx" ON "users" USING gin ("roles");--> statement-breakpoint
ALTER TABLE "invitations" DROP COLUMN "role";--> statement-breakpoint
ALTER TABLE "users" DROP COLUMN "role";--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_roles_present" CHECK (cardinality("invitations"."roles") > 0);--> statement-breakpoint
ALTER TABLE "users" ADD CONSTRAINT "users_roles_present" CHECK (cardinality("users"."roles") > 0);--> statement-breakpoint
ALTER TABLE "analysis_runs" ADD CONSTRAINT "analysis_runs_permutations" CHECK ("analysis_runs"."permutations" between 0 and 99999);