ALTER TABLE "technical_signoffs" DROP CONSTRAINT "technical_signoffs_pkey";--> statement-breakpoint
ALTER TABLE "technical_signoffs" ADD CONSTRAINT "technical_signoffs_tender_id_signed_by_pk" PRIMARY KEY("tender_id","signed_by");--> statement-breakpoint
ALTER TABLE "evidence_runs" ADD COLUMN "finding" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "tenders" ADD COLUMN "safety_relevant" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "threads" ADD COLUMN "closed_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "threads" ADD COLUMN "closed_by" text;--> statement-breakpoint
ALTER TABLE "threads" ADD COLUMN "close_reason" text;--> statement-breakpoint
ALTER TABLE "threads" ADD CONSTRAINT "threads_closed_by_user_id_fk" FOREIGN KEY ("closed_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;