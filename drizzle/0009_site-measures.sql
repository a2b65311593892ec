ALTER TABLE "cases" ADD COLUMN "site_measures" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "survey_outcomes" ADD COLUMN "earthing_measure" text;