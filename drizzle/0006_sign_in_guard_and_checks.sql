CREATE TABLE "rate_limits" (
	"key" text PRIMARY KEY NOT NULL,
	"count" integer NOT NULL,
	"window_start" bigint NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sign_in_failures" (
	"id" text PRIMARY KEY NOT NULL,
	"email" text NOT NULL,
	"address" text NOT NULL,
	"device" text,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE INDEX "sign_in_failures_email_idx" ON "sign_in_failures" USING btree ("email","at");--> statement-breakpoint
CREATE INDEX "sign_in_failures_at_idx" ON "sign_in_failures" USING btree ("at");--> statement-breakpoint
ALTER TABLE "organisations" ADD CONSTRAINT "organisations_kind_check" CHECK ("organisations"."kind" in ('buyer', 'vendor'));--> statement-breakpoint
ALTER TABLE "user_roles" ADD CONSTRAINT "user_roles_role_check" CHECK ("user_roles"."role" in ('admin', 'buyer', 'engineer', 'approver', 'vendor'));--> statement-breakpoint
ALTER TABLE "tenders" ADD CONSTRAINT "tenders_state_check" CHECK ("tenders"."state" in ('draft', 'open', 'technical', 'commercial', 'approval', 'awarded', 'cancelled'));--> statement-breakpoint
ALTER TABLE "claims" ADD CONSTRAINT "claims_verdict_check" CHECK ("claims"."verdict" in ('impossible', 'needs-evidence', 'plausible'));--> statement-breakpoint
ALTER TABLE "offers" ADD CONSTRAINT "offers_status_check" CHECK ("offers"."status" in ('submitted', 'superseded', 'withdrawn'));--> statement-breakpoint
ALTER TABLE "evidence_runs" ADD CONSTRAINT "evidence_status_check" CHECK ("evidence_runs"."status" in ('verified', 'contradicted', 'inconclusive'));--> statement-breakpoint
ALTER TABLE "marks" ADD CONSTRAINT "marks_mark_check" CHECK ("marks"."mark" in ('accepted', 'rejected-impossible', 'evidence-requested', 'clarification-requested'));--> statement-breakpoint
ALTER TABLE "recommendations" ADD CONSTRAINT "recommendations_status_check" CHECK ("recommendations"."status" in ('pending', 'returned', 'approved', 'superseded', 'withdrawn'));