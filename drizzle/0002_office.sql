CREATE TYPE "public"."readiness_light" AS ENUM('green', 'amber', 'red');--> statement-breakpoint
CREATE TABLE "case_notes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"case_id" uuid NOT NULL,
	"author_id" text,
	"body" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "email_log" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"case_id" uuid,
	"kind" text NOT NULL,
	"to_email" text NOT NULL,
	"subject" text NOT NULL,
	"text" text NOT NULL,
	"sent_by_id" text,
	"message_id" text,
	"dedupe_key" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "email_log_dedupe_key_unique" UNIQUE("dedupe_key")
);
--> statement-breakpoint
ALTER TABLE "cases" ADD COLUMN "readiness_light" "readiness_light" DEFAULT 'amber' NOT NULL;--> statement-breakpoint
ALTER TABLE "cases" ADD COLUMN "readiness_rank" integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE "cases" ADD COLUMN "readiness_gaps" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "cases" ADD COLUMN "readiness_checks" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "cases" ADD COLUMN "readiness_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "cases" ADD COLUMN "reminders_sent" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "cases" ADD COLUMN "last_chased_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "case_notes" ADD CONSTRAINT "case_notes_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_notes" ADD CONSTRAINT "case_notes_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "email_log" ADD CONSTRAINT "email_log_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "email_log" ADD CONSTRAINT "email_log_sent_by_id_users_id_fk" FOREIGN KEY ("sent_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "case_notes_case_idx" ON "case_notes" USING btree ("case_id","created_at");--> statement-breakpoint
CREATE INDEX "email_log_case_idx" ON "email_log" USING btree ("case_id","created_at");--> statement-breakpoint
CREATE INDEX "cases_light_idx" ON "cases" USING btree ("readiness_rank","invited_at");--> statement-breakpoint
CREATE INDEX "cases_invited_idx" ON "cases" USING btree ("invited_at");--> statement-breakpoint
CREATE INDEX "cases_postcode_idx" ON "cases" USING btree ("postcode");