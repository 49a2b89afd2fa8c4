CREATE TABLE "invitation_token_failures" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"ip_key" text NOT NULL,
	"attempted_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE INDEX "invitation_token_failures_ip_idx" ON "invitation_token_failures" USING btree ("ip_key","attempted_at");--> statement-breakpoint
CREATE INDEX "invitation_token_failures_attempted_at_idx" ON "invitation_token_failures" USING btree ("attempted_at");--> statement-breakpoint
CREATE INDEX "sign_in_attempts_pair_idx" ON "sign_in_attempts" USING btree ("email_key","ip_key","attempted_at");--> statement-breakpoint
CREATE INDEX "sign_in_attempts_attempted_at_idx" ON "sign_in_attempts" USING btree ("attempted_at");