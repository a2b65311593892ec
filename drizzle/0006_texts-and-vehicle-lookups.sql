CREATE TABLE "case_vehicle_lookups" (
	"case_id" uuid PRIMARY KEY NOT NULL,
	"registration" text NOT NULL,
	"make" text,
	"colour" text,
	"fuel_type" text,
	"year_of_manufacture" integer,
	"looked_up_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "lookup_counters" (
	"user_id" text NOT NULL,
	"window_start" timestamp with time zone NOT NULL,
	"count" integer DEFAULT 0 NOT NULL,
	CONSTRAINT "lookup_counters_user_id_window_start_pk" PRIMARY KEY("user_id","window_start")
);
--> statement-breakpoint
CREATE TABLE "text_consents" (
	"user_id" text PRIMARY KEY NOT NULL,
	"mobile" text NOT NULL,
	"consented_at" timestamp with time zone NOT NULL,
	"withdrawn_at" timestamp with time zone,
	"withdrawn_via" text
);
--> statement-breakpoint
CREATE TABLE "text_log" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"case_id" uuid,
	"user_id" text,
	"direction" text DEFAULT 'outbound' NOT NULL,
	"kind" text NOT NULL,
	"mobile" text NOT NULL,
	"text" text NOT NULL,
	"provider_id" text,
	"status" text DEFAULT 'queued' NOT NULL,
	"status_detail" text,
	"status_at" timestamp with time zone,
	"sent_by_id" text,
	"dedupe_key" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "text_log_dedupe_key_unique" UNIQUE("dedupe_key")
);
--> statement-breakpoint
CREATE TABLE "vehicle_lookup_cache" (
	"registration" text PRIMARY KEY NOT NULL,
	"found" boolean NOT NULL,
	"make" text,
	"colour" text,
	"fuel_type" text,
	"year_of_manufacture" integer,
	"fetched_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "case_vehicle_lookups" ADD CONSTRAINT "case_vehicle_lookups_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lookup_counters" ADD CONSTRAINT "lookup_counters_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "text_consents" ADD CONSTRAINT "text_consents_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "text_log" ADD CONSTRAINT "text_log_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "text_log" ADD CONSTRAINT "text_log_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "text_log" ADD CONSTRAINT "text_log_sent_by_id_users_id_fk" FOREIGN KEY ("sent_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "text_consents_mobile_idx" ON "text_consents" USING btree ("mobile");--> statement-breakpoint
CREATE INDEX "text_log_case_idx" ON "text_log" USING btree ("case_id","created_at");--> statement-breakpoint
CREATE INDEX "text_log_provider_idx" ON "text_log" USING btree ("provider_id");