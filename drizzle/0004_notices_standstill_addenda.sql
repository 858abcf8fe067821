CREATE TABLE "addenda" (
	"id" text PRIMARY KEY NOT NULL,
	"tender_id" text NOT NULL,
	"thread_id" text,
	"title" text NOT NULL,
	"body" text NOT NULL,
	"published_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "addendum_acknowledgements" (
	"addendum_id" text NOT NULL,
	"vendor_org_id" text NOT NULL,
	"acknowledged_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "addendum_acknowledgements_addendum_id_vendor_org_id_pk" PRIMARY KEY("addendum_id","vendor_org_id")
);
--> statement-breakpoint
CREATE TABLE "objections" (
	"id" text PRIMARY KEY NOT NULL,
	"tender_id" text NOT NULL,
	"vendor_org_id" text NOT NULL,
	"body" text NOT NULL,
	"lodged_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "tenders" ADD COLUMN "notice_disclosure" text DEFAULT 'rank' NOT NULL;--> statement-breakpoint
ALTER TABLE "tenders" ADD COLUMN "standstill_days" integer DEFAULT 10 NOT NULL;--> statement-breakpoint
ALTER TABLE "addenda" ADD CONSTRAINT "addenda_tender_id_tenders_id_fk" FOREIGN KEY ("tender_id") REFERENCES "public"."tenders"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "addenda" ADD CONSTRAINT "addenda_thread_id_threads_id_fk" FOREIGN KEY ("thread_id") REFERENCES "public"."threads"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "addenda" ADD CONSTRAINT "addenda_published_by_user_id_fk" FOREIGN KEY ("published_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "addendum_acknowledgements" ADD CONSTRAINT "addendum_acknowledgements_addendum_id_addenda_id_fk" FOREIGN KEY ("addendum_id") REFERENCES "public"."addenda"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "addendum_acknowledgements" ADD CONSTRAINT "addendum_acknowledgements_vendor_org_id_organisations_id_fk" FOREIGN KEY ("vendor_org_id") REFERENCES "public"."organisations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "addendum_acknowledgements" ADD CONSTRAINT "addendum_acknowledgements_acknowledged_by_user_id_fk" FOREIGN KEY ("acknowledged_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "objections" ADD CONSTRAINT "objections_tender_id_tenders_id_fk" FOREIGN KEY ("tender_id") REFERENCES "public"."tenders"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "objections" ADD CONSTRAINT "objections_vendor_org_id_organisations_id_fk" FOREIGN KEY ("vendor_org_id") REFERENCES "public"."organisations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "objections" ADD CONSTRAINT "objections_lodged_by_user_id_fk" FOREIGN KEY ("lodged_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "addenda_tender_idx" ON "addenda" USING btree ("tender_id");--> statement-breakpoint
CREATE INDEX "objections_tender_idx" ON "objections" USING btree ("tender_id");