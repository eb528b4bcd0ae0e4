-- The admin payments table is most often filtered by status and plan and sorted by amount or date.
-- These two b-trees hold each filter combination's rows in the table's order, carrying the columns
-- the other filters read (date, amount, person), so a page is read by walking one index from its end
-- and stopping after the page, not by sorting every match (PostgreSQL docs: "Indexes and ORDER BY",
-- "Index-Only Scans and Covering Indexes"). scripts/bench-payments.ts measures it.
CREATE INDEX IF NOT EXISTS "payments_status_plan_amount_idx" ON "payments" ("status", "plan_id", "amount", "id") INCLUDE ("created_at", "user_id");--> statement-breakpoint
CREATE INDEX IF NOT EXISTS "payments_status_plan_created_idx" ON "payments" ("status", "plan_id", "created_at", "id") INCLUDE ("amount", "user_id");
