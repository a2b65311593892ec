ALTER TABLE "cases" ADD COLUMN "prefilled" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "cases" ADD COLUMN "details_confirmed_at" timestamp with time zone;