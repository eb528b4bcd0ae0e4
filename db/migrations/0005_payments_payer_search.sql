-- The admin payments table searched by a name or address that several hundred to a few thousand
-- people share (2 % or more of them) was its slowest request: the walk in the table's order tested
-- each payment's payer by a lookup in users. This column carries the payer's name and address,
-- lower-cased, on each payment, and the two sorted indexes carry the column, so such a search tests
-- it inside the index walk (db/queries/admin-payments.ts payerFilter; scripts/bench-payments.ts
-- measures it). A trigger fills it on insert, another keeps it in step when a person's name or
-- address changes; users stays the truth. Name and address are lower-cased apart and joined by a
-- line break, which a search cannot contain (lib/billing/admin/params.ts), so no match spans both.
ALTER TABLE "payments" ADD COLUMN IF NOT EXISTS "payer_search" text DEFAULT '' NOT NULL;--> statement-breakpoint
CREATE OR REPLACE FUNCTION "payments_fill_payer_search"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  SELECT lower(u.name) || E'\n' || lower(u.email) INTO NEW.payer_search FROM users u WHERE u.id = NEW.user_id;
  RETURN NEW;
END $$;--> statement-breakpoint
CREATE TRIGGER "payments_fill_payer_search" BEFORE INSERT OR UPDATE OF "user_id" ON "payments"
  FOR EACH ROW EXECUTE FUNCTION "payments_fill_payer_search"();--> statement-breakpoint
CREATE OR REPLACE FUNCTION "users_keep_payer_search"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  UPDATE payments SET payer_search = lower(NEW.name) || E'\n' || lower(NEW.email) WHERE user_id = NEW.id;
  RETURN NULL;
END $$;--> statement-breakpoint
CREATE TRIGGER "users_keep_payer_search" AFTER UPDATE OF "name", "email" ON "users"
  FOR EACH ROW WHEN (OLD.name IS DISTINCT FROM NEW.name OR OLD.email IS DISTINCT FROM NEW.email)
  EXECUTE FUNCTION "users_keep_payer_search"();--> statement-breakpoint
UPDATE "payments" p SET "payer_search" = lower(u.name) || E'\n' || lower(u.email) FROM "users" u WHERE u.id = p.user_id;--> statement-breakpoint
DROP INDEX IF EXISTS "payments_status_plan_amount_idx";--> statement-breakpoint
DROP INDEX IF EXISTS "payments_status_plan_created_idx";--> statement-breakpoint
CREATE INDEX IF NOT EXISTS "payments_status_plan_amount_idx" ON "payments" ("status", "plan_id", "amount", "id") INCLUDE ("created_at", "user_id", "payer_search");--> statement-breakpoint
CREATE INDEX IF NOT EXISTS "payments_status_plan_created_idx" ON "payments" ("status", "plan_id", "created_at", "id") INCLUDE ("amount", "user_id", "payer_search");
