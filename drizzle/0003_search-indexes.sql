-- Trigram indexes so the office's search (name, e-mail, postcode, MPAN) uses an index for ILIKE '%…%'.
CREATE EXTENSION IF NOT EXISTS pg_trgm;--> statement-breakpoint
CREATE INDEX IF NOT EXISTS "users_name_trgm_idx" ON "users" USING gin ("name" gin_trgm_ops);--> statement-breakpoint
CREATE INDEX IF NOT EXISTS "users_email_trgm_idx" ON "users" USING gin ("email" gin_trgm_ops);--> statement-breakpoint
CREATE INDEX IF NOT EXISTS "cases_postcode_trgm_idx" ON "cases" USING gin ((replace("postcode", ' ', '')) gin_trgm_ops);--> statement-breakpoint
CREATE INDEX IF NOT EXISTS "cases_mpan_idx" ON "cases" ((("checklist" -> 'supply') ->> 'mpanCore'));--> statement-breakpoint
CREATE INDEX IF NOT EXISTS "cases_delivery_idx" ON "cases" ((("checklist" -> 'vehicle') ->> 'deliveryDate'));
