ALTER TABLE "tenders" ADD COLUMN "assumed_noise_figure_db" double precision DEFAULT 6 NOT NULL;--> statement-breakpoint
ALTER TABLE "claims" ADD COLUMN "radio" jsonb;