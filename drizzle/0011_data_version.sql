CREATE TABLE "data_version" (
	"id" smallint PRIMARY KEY DEFAULT 1 NOT NULL,
	"value" bigint DEFAULT 0 NOT NULL,
	CONSTRAINT "data_version_one_row" CHECK ("data_version"."id" = 1)
);
--> statement-breakpoint
INSERT INTO "data_version" ("id", "value") VALUES (1, 0);--> statement-breakpoint
-- Counts committed changes once per transaction, at commit (the trigger is deferred), so the new count and
-- the change become visible together and the row is locked only for the moment of the commit.
CREATE FUNCTION "data_version_bump"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
	IF current_setting('tackline.data_version_bumped', true) IS DISTINCT FROM txid_current()::text THEN
		PERFORM set_config('tackline.data_version_bumped', txid_current()::text, true);
		UPDATE "data_version" SET "value" = "value" + 1 WHERE "id" = 1;
	END IF;
	RETURN NULL;
END;
$$;--> statement-breakpoint
CREATE FUNCTION "data_version_bump_now"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
	UPDATE "data_version" SET "value" = "value" + 1 WHERE "id" = 1;
	RETURN NULL;
END;
$$;--> statement-breakpoint
-- Every table the pages read. Left out: the rate limit's counters, sessions and sign-in links (a kept answer
-- checks its session directly), the payment processor's delivered-event log, and the count itself.
DO $$
DECLARE
	t text;
BEGIN
	FOR t IN
		SELECT tablename FROM pg_tables
		WHERE schemaname = 'public'
			AND tablename NOT IN ('data_version', 'rate_limit', 'session', 'verification_token', 'processed_webhook_event')
	LOOP
		EXECUTE format(
			'CREATE CONSTRAINT TRIGGER "data_version_bump" AFTER INSERT OR UPDATE OR DELETE ON %I '
			'DEFERRABLE INITIALLY DEFERRED FOR EACH ROW EXECUTE FUNCTION "data_version_bump"()', t);
		EXECUTE format(
			'CREATE TRIGGER "data_version_bump_truncate" AFTER TRUNCATE ON %I '
			'FOR EACH STATEMENT EXECUTE FUNCTION "data_version_bump_now"()', t);
	END LOOP;
END;
$$;
