CREATE TABLE "memo_previews" (
	"recommendation_id" text PRIMARY KEY NOT NULL,
	"inputs_hash" text NOT NULL,
	"pdf" "bytea" NOT NULL,
	"rendered_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "memo_previews" ADD CONSTRAINT "memo_previews_recommendation_id_recommendations_id_fk" FOREIGN KEY ("recommendation_id") REFERENCES "public"."recommendations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "tender_invitations_org_idx" ON "tender_invitations" USING btree ("organisation_id","tender_id");--> statement-breakpoint
CREATE INDEX "tenders_list_order_idx" ON "tenders" USING btree ("created_at" DESC NULLS FIRST,"reference");--> statement-breakpoint
CREATE INDEX "marks_claim_latest_idx" ON "marks" USING btree ("claim_id","created_at" DESC NULLS FIRST,"id" DESC NULLS FIRST);--> statement-breakpoint
CREATE INDEX "ledger_tender_seq_idx" ON "ledger_entries" USING btree ("tender_id","seq");