ALTER TABLE "tenders" ADD COLUMN "cancelled_sealed" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "objections" ADD COLUMN "answer" text;--> statement-breakpoint
ALTER TABLE "objections" ADD COLUMN "answered_by" text;--> statement-breakpoint
ALTER TABLE "objections" ADD COLUMN "answered_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "objections" ADD CONSTRAINT "objections_answered_by_user_id_fk" FOREIGN KEY ("answered_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;