ALTER TABLE "recommendations" ADD COLUMN "computed_value" numeric(16, 2);--> statement-breakpoint
ALTER TABLE "recommendations" ADD COLUMN "value_reason" text;--> statement-breakpoint
ALTER TABLE "recommendations" ADD COLUMN "quantity_reason" text;--> statement-breakpoint
ALTER TABLE "recommendations" ADD COLUMN "withdraw_reason" text;