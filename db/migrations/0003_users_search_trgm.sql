-- The admin money tables search people by any part of their name or address (ILIKE '%…%'), which a
-- b-tree cannot serve; trigram GIN indexes can (PostgreSQL docs: pg_trgm, "Index Support"). pg_trgm is
-- a trusted extension (PostgreSQL 13+), so the database owner may create it. A payments index by
-- person and date, carrying the columns the filters read, lets the search's matches be joined to
-- their payments without visiting every payment row (scripts/bench-payments.ts measures it).
CREATE EXTENSION IF NOT EXISTS pg_trgm;--> statement-breakpoint
CREATE INDEX IF NOT EXISTS "users_name_trgm_idx" ON "users" USING gin ("name" gin_trgm_ops);--> statement-breakpoint
CREATE INDEX IF NOT EXISTS "users_email_trgm_idx" ON "users" USING gin ("email" gin_trgm_ops);--> statement-breakpoint
CREATE INDEX IF NOT EXISTS "payments_user_created_idx" ON "payments" ("user_id", "created_at") INCLUDE ("status", "plan_id", "amount", "id");
