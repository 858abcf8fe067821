CREATE TABLE "ledger_checkpoints" (
	"seq" bigint PRIMARY KEY NOT NULL,
	"hash" text NOT NULL,
	"at" text NOT NULL,
	"reason" text NOT NULL,
	"signature" text NOT NULL
);
--> statement-breakpoint
CREATE TABLE "ledger_full_checks" (
	"id" text PRIMARY KEY NOT NULL,
	"started_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"through_seq" bigint NOT NULL,
	"total" integer NOT NULL,
	"checked_seq" bigint NOT NULL,
	"checked_hash" text NOT NULL,
	"checked" integer NOT NULL,
	"status" text NOT NULL,
	"broken_at" bigint,
	"reason" text,
	"finished_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "ledger_verification" (
	"id" text PRIMARY KEY NOT NULL,
	"seq" bigint NOT NULL,
	"hash" text NOT NULL,
	"verified_at" timestamp with time zone NOT NULL,
	"broken_at" bigint,
	"reason" text
);
--> statement-breakpoint
ALTER TABLE "memos" ADD COLUMN "ledger_seq" bigint;--> statement-breakpoint
ALTER TABLE "memos" ADD COLUMN "ledger_hash" text;--> statement-breakpoint
ALTER TABLE "ledger_full_checks" ADD CONSTRAINT "ledger_full_checks_started_by_user_id_fk" FOREIGN KEY ("started_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;