-- The admin payments table keeps, per process, the ids of the people a name search found
-- (db/queries/payer-search.ts), and must forget them as soon as the people change. Every statement
-- that adds, removes or renames people (name or address) announces it on the channel
-- rosinwood_people; PostgreSQL delivers the notice at commit, once per transaction for the same
-- channel and payload (PostgreSQL docs: NOTIFY), and every app process listening forgets what it kept.
CREATE OR REPLACE FUNCTION "users_announce_people"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  PERFORM pg_notify('rosinwood_people', '');
  RETURN NULL;
END $$;--> statement-breakpoint
CREATE TRIGGER "users_announce_people" AFTER INSERT OR DELETE OR UPDATE OF "name", "email" ON "users"
  FOR EACH STATEMENT EXECUTE FUNCTION "users_announce_people"();
