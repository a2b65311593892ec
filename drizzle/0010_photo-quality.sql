ALTER TABLE "uploads" ADD COLUMN "quality_ok" boolean;--> statement-breakpoint
ALTER TABLE "uploads" ADD COLUMN "quality" jsonb;--> statement-breakpoint
ALTER TABLE "uploads" ADD COLUMN "perceptual_hash" text;