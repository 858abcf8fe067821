CREATE TABLE "approval_bands" (
	"id" text PRIMARY KEY NOT NULL,
	"currency" text NOT NULL,
	"min_value" numeric(16, 2) NOT NULL,
	"max_value" numeric(16, 2),
	"approvals_needed" integer NOT NULL,
	"min_approver_limit" numeric(16, 2) NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "approvals" (
	"id" text PRIMARY KEY NOT NULL,
	"recommendation_id" text NOT NULL,
	"tender_id" text NOT NULL,
	"approver_id" text NOT NULL,
	"decision" text NOT NULL,
	"comment" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "claims" (
	"id" text PRIMARY KEY NOT NULL,
	"offer_id" text NOT NULL,
	"tender_id" text NOT NULL,
	"vendor_org_id" text NOT NULL,
	"point_index" integer NOT NULL,
	"point_label" text NOT NULL,
	"channel_value" double precision NOT NULL,
	"metric" text NOT NULL,
	"value" double precision NOT NULL,
	"ncg_output_ber" double precision,
	"verdict" text NOT NULL,
	"result" jsonb NOT NULL,
	"engine_version" text NOT NULL,
	"evaluated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "documents" (
	"id" text PRIMARY KEY NOT NULL,
	"offer_id" text,
	"tender_id" text NOT NULL,
	"vendor_org_id" text NOT NULL,
	"kind" text NOT NULL,
	"file_name" text NOT NULL,
	"content_type" text NOT NULL,
	"size" integer NOT NULL,
	"sha256" text NOT NULL,
	"storage_key" text NOT NULL,
	"uploaded_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "documents_storage_key_unique" UNIQUE("storage_key")
);
--> statement-breakpoint
CREATE TABLE "evidence_runs" (
	"id" text PRIMARY KEY NOT NULL,
	"claim_id" text NOT NULL,
	"tender_id" text NOT NULL,
	"vendor_org_id" text NOT NULL,
	"channel_value" double precision NOT NULL,
	"unit" text NOT NULL,
	"trials" double precision NOT NULL,
	"errors" double precision NOT NULL,
	"confidence" double precision NOT NULL,
	"lower" double precision NOT NULL,
	"upper" double precision NOT NULL,
	"status" text NOT NULL,
	"error_free_trials_needed" double precision,
	"source" text DEFAULT 'manual' NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"recorded_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "marks" (
	"id" text PRIMARY KEY NOT NULL,
	"claim_id" text NOT NULL,
	"tender_id" text NOT NULL,
	"vendor_org_id" text NOT NULL,
	"mark" text NOT NULL,
	"comment" text DEFAULT '' NOT NULL,
	"marked_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "memos" (
	"id" text PRIMARY KEY NOT NULL,
	"identifier" text NOT NULL,
	"tender_id" text NOT NULL,
	"recommendation_id" text NOT NULL,
	"sha256" text NOT NULL,
	"storage_key" text NOT NULL,
	"size" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "memos_identifier_unique" UNIQUE("identifier"),
	CONSTRAINT "memos_tender_id_unique" UNIQUE("tender_id"),
	CONSTRAINT "memos_sha256_unique" UNIQUE("sha256")
);
--> statement-breakpoint
CREATE TABLE "offers" (
	"id" text PRIMARY KEY NOT NULL,
	"tender_id" text NOT NULL,
	"vendor_org_id" text NOT NULL,
	"version" integer NOT NULL,
	"status" text DEFAULT 'submitted' NOT NULL,
	"module_name" text NOT NULL,
	"part_number" text NOT NULL,
	"code_family" text NOT NULL,
	"decision" text NOT NULL,
	"n" integer,
	"k" integer,
	"rate" double precision,
	"overhead" double precision,
	"unit_price" numeric(14, 2) NOT NULL,
	"currency" text NOT NULL,
	"lead_time_weeks" integer NOT NULL,
	"warranty_months" integer NOT NULL,
	"price_breaks" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"submitted_by" text NOT NULL,
	"submitted_at" timestamp with time zone DEFAULT now() NOT NULL,
	"withdrawn_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "recommendations" (
	"id" text PRIMARY KEY NOT NULL,
	"tender_id" text NOT NULL,
	"offer_id" text NOT NULL,
	"quantity" integer NOT NULL,
	"value" numeric(16, 2) NOT NULL,
	"currency" text NOT NULL,
	"justification" text NOT NULL,
	"status" text DEFAULT 'pending' NOT NULL,
	"approvals_needed" integer,
	"min_approver_limit" numeric(16, 2),
	"score_sheet" jsonb,
	"prepared_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "technical_signoffs" (
	"tender_id" text PRIMARY KEY NOT NULL,
	"signed_by" text NOT NULL,
	"statement" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "thread_messages" (
	"id" text PRIMARY KEY NOT NULL,
	"thread_id" text NOT NULL,
	"author_id" text NOT NULL,
	"author_label" text NOT NULL,
	"body" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "threads" (
	"id" text PRIMARY KEY NOT NULL,
	"tender_id" text NOT NULL,
	"vendor_org_id" text NOT NULL,
	"claim_id" text,
	"subject" text NOT NULL,
	"created_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "tenders" ADD COLUMN "technical_signed_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "tenders" ADD COLUMN "envelopes_opened_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "tenders" ADD COLUMN "awarded_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "approvals" ADD CONSTRAINT "approvals_recommendation_id_recommendations_id_fk" FOREIGN KEY ("recommendation_id") REFERENCES "public"."recommendations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "approvals" ADD CONSTRAINT "approvals_tender_id_tenders_id_fk" FOREIGN KEY ("tender_id") REFERENCES "public"."tenders"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "approvals" ADD CONSTRAINT "approvals_approver_id_user_id_fk" FOREIGN KEY ("approver_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "claims" ADD CONSTRAINT "claims_offer_id_offers_id_fk" FOREIGN KEY ("offer_id") REFERENCES "public"."offers"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "claims" ADD CONSTRAINT "claims_tender_id_tenders_id_fk" FOREIGN KEY ("tender_id") REFERENCES "public"."tenders"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "claims" ADD CONSTRAINT "claims_vendor_org_id_organisations_id_fk" FOREIGN KEY ("vendor_org_id") REFERENCES "public"."organisations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "documents" ADD CONSTRAINT "documents_offer_id_offers_id_fk" FOREIGN KEY ("offer_id") REFERENCES "public"."offers"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "documents" ADD CONSTRAINT "documents_tender_id_tenders_id_fk" FOREIGN KEY ("tender_id") REFERENCES "public"."tenders"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "documents" ADD CONSTRAINT "documents_vendor_org_id_organisations_id_fk" FOREIGN KEY ("vendor_org_id") REFERENCES "public"."organisations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "documents" ADD CONSTRAINT "documents_uploaded_by_user_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "evidence_runs" ADD CONSTRAINT "evidence_runs_claim_id_claims_id_fk" FOREIGN KEY ("claim_id") REFERENCES "public"."claims"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "evidence_runs" ADD CONSTRAINT "evidence_runs_tender_id_tenders_id_fk" FOREIGN KEY ("tender_id") REFERENCES "public"."tenders"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "evidence_runs" ADD CONSTRAINT "evidence_runs_vendor_org_id_organisations_id_fk" FOREIGN KEY ("vendor_org_id") REFERENCES "public"."organisations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "evidence_runs" ADD CONSTRAINT "evidence_runs_recorded_by_user_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "marks" ADD CONSTRAINT "marks_claim_id_claims_id_fk" FOREIGN KEY ("claim_id") REFERENCES "public"."claims"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "marks" ADD CONSTRAINT "marks_tender_id_tenders_id_fk" FOREIGN KEY ("tender_id") REFERENCES "public"."tenders"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "marks" ADD CONSTRAINT "marks_vendor_org_id_organisations_id_fk" FOREIGN KEY ("vendor_org_id") REFERENCES "public"."organisations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "marks" ADD CONSTRAINT "marks_marked_by_user_id_fk" FOREIGN KEY ("marked_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "memos" ADD CONSTRAINT "memos_tender_id_tenders_id_fk" FOREIGN KEY ("tender_id") REFERENCES "public"."tenders"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "memos" ADD CONSTRAINT "memos_recommendation_id_recommendations_id_fk" FOREIGN KEY ("recommendation_id") REFERENCES "public"."recommendations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "offers" ADD CONSTRAINT "offers_tender_id_tenders_id_fk" FOREIGN KEY ("tender_id") REFERENCES "public"."tenders"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "offers" ADD CONSTRAINT "offers_vendor_org_id_organisations_id_fk" FOREIGN KEY ("vendor_org_id") REFERENCES "public"."organisations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "offers" ADD CONSTRAINT "offers_submitted_by_user_id_fk" FOREIGN KEY ("submitted_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recommendations" ADD CONSTRAINT "recommendations_tender_id_tenders_id_fk" FOREIGN KEY ("tender_id") REFERENCES "public"."tenders"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recommendations" ADD CONSTRAINT "recommendations_offer_id_offers_id_fk" FOREIGN KEY ("offer_id") REFERENCES "public"."offers"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "recommendations" ADD CONSTRAINT "recommendations_prepared_by_user_id_fk" FOREIGN KEY ("prepared_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "technical_signoffs" ADD CONSTRAINT "technical_signoffs_tender_id_tenders_id_fk" FOREIGN KEY ("tender_id") REFERENCES "public"."tenders"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "technical_signoffs" ADD CONSTRAINT "technical_signoffs_signed_by_user_id_fk" FOREIGN KEY ("signed_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "thread_messages" ADD CONSTRAINT "thread_messages_thread_id_threads_id_fk" FOREIGN KEY ("thread_id") REFERENCES "public"."threads"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "thread_messages" ADD CONSTRAINT "thread_messages_author_id_user_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "threads" ADD CONSTRAINT "threads_tender_id_tenders_id_fk" FOREIGN KEY ("tender_id") REFERENCES "public"."tenders"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "threads" ADD CONSTRAINT "threads_vendor_org_id_organisations_id_fk" FOREIGN KEY ("vendor_org_id") REFERENCES "public"."organisations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "threads" ADD CONSTRAINT "threads_claim_id_claims_id_fk" FOREIGN KEY ("claim_id") REFERENCES "public"."claims"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "threads" ADD CONSTRAINT "threads_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "approvals_once_idx" ON "approvals" USING btree ("recommendation_id","approver_id");--> statement-breakpoint
CREATE INDEX "claims_offer_idx" ON "claims" USING btree ("offer_id");--> statement-breakpoint
CREATE INDEX "claims_tender_idx" ON "claims" USING btree ("tender_id");--> statement-breakpoint
CREATE INDEX "documents_tender_idx" ON "documents" USING btree ("tender_id","vendor_org_id");--> statement-breakpoint
CREATE INDEX "evidence_claim_idx" ON "evidence_runs" USING btree ("claim_id");--> statement-breakpoint
CREATE INDEX "marks_claim_idx" ON "marks" USING btree ("claim_id");--> statement-breakpoint
CREATE UNIQUE INDEX "offers_version_idx" ON "offers" USING btree ("tender_id","vendor_org_id","version");--> statement-breakpoint
CREATE INDEX "offers_tender_idx" ON "offers" USING btree ("tender_id");--> statement-breakpoint
CREATE INDEX "recommendations_tender_idx" ON "recommendations" USING btree ("tender_id");--> statement-breakpoint
CREATE INDEX "thread_messages_thread_idx" ON "thread_messages" USING btree ("thread_id");--> statement-breakpoint
CREATE INDEX "threads_tender_idx" ON "threads" USING btree ("tender_id","vendor_org_id");