CREATE TYPE "public"."survey_outcome" AS ENUM('go_ahead', 'go_ahead_with_changes', 'cannot_install');--> statement-breakpoint
CREATE TABLE "survey_outcomes" (
	"case_id" uuid PRIMARY KEY NOT NULL,
	"outcome" "survey_outcome" NOT NULL,
	"confirmed_earthing" text,
	"confirmed_fuse_amps" integer,
	"measurements" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"notes" text,
	"surveyor_id" text,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "survey_outcomes" ADD CONSTRAINT "survey_outcomes_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "survey_outcomes" ADD CONSTRAINT "survey_outcomes_surveyor_id_users_id_fk" FOREIGN KEY ("surveyor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;