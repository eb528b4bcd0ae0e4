-- payments_user_created_idx (user_id, created_at; migration 0003) serves every lookup by person,
-- including the foreign key's check when a person is deleted. The index on user_id alone was one more
-- the planner weighed for every admin payments page: planning the 200-person page took 0.46 ms
-- without it against 0.54 ms with it (EXPLAIN SUMMARY, median of 25, bench-payments' database).
DROP INDEX "payments_user_idx";