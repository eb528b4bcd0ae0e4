-- The admin payments table sorted by amount walks payments_status_plan_amount_idx in its order and
-- tests each entry's date and payer. With created_at among the INCLUDE columns, every entry walked
-- was read out of the index and tested by the executor; as the last key column (after id, which is
-- unique, so the order is unchanged) the date range is tested inside the B-tree as each entry is
-- reached, and only entries in range are read out for the payer test (PostgreSQL docs: "Multicolumn
-- Indexes"; EXPLAIN shows the range under Index Cond instead of Filter). bench-payments' "wood" page
-- (800 people, 92 days, page 3) walked 8,547 entries either way; pgbench put its statement at
-- 2.0–2.1 ms instead of 3.0, and the page without a search at 0.8–0.9 ms instead of 1.0 (this machine).
DROP INDEX IF EXISTS "payments_status_plan_amount_idx";--> statement-breakpoint
CREATE INDEX IF NOT EXISTS "payments_status_plan_amount_idx" ON "payments" ("status", "plan_id", "amount", "id", "created_at") INCLUDE ("user_id", "payer_search");
