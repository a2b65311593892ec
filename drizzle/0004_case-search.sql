ALTER TABLE "cases" ADD COLUMN "search_text" text DEFAULT '' NOT NULL;--> statement-breakpoint
UPDATE "cases" c SET "search_text" = lower(concat_ws(' ', u.name, u.email, replace(coalesce(c.postcode, ''), ' ', ''), c.reference, c.checklist -> 'supply' ->> 'mpanCore')) FROM "users" u WHERE u.id = c.customer_id;--> statement-breakpoint
CREATE INDEX IF NOT EXISTS "cases_search_trgm_idx" ON "cases" USING gin ("search_text" gin_trgm_ops);
