-- The admin payments search reads users (trigram indexes, migration 0003) instead of a copy of the
-- payer on each payment: the copy, its triggers and the people-changed notice go. Dropping the column
-- drops the two sorted indexes that carried it; they come back without it.
DROP TRIGGER IF EXISTS "users_announce_people" ON "users";--> statement-breakpoint
DROP FUNCTION IF EXISTS "users_announce_people"();--> statement-breakpoint
DROP TRIGGER IF EXISTS "users_keep_payer_search" ON "users";--> statement-breakpoint
DROP FUNCTION IF EXISTS "users_keep_payer_search"();--> statement-breakpoint
DROP TRIGGER IF EXISTS "payments_fill_payer_search" ON "payments";--> statement-breakpoint
DROP FUNCTION IF EXISTS "payments_fill_payer_search"();--> statement-breakpoint
DROP INDEX IF EXISTS "payments_status_plan_created_idx";--> statement-breakpoint
DROP INDEX IF EXISTS "payments_status_plan_amount_idx";--> statement-breakpoint
ALTER TABLE "payments" DROP COLUMN "payer_search";--> statement-breakpoint
CREATE INDEX "payments_status_plan_created_idx" ON "payments" USING btree ("status","plan_id","created_at","id");--> statement-breakpoint
CREATE INDEX "payments_status_plan_amount_idx" ON "payments" USING btree ("status","plan_id","amount","id","created_at");
