-- The analytics cache is keyed by registry_data_version.version. Every statement that writes to a table the
-- outcome numbers are computed from bumps it once (statement-level, so a bulk insert costs one update).
-- The bump commits with the write, so a reader never sees a new version before the new data.
INSERT INTO "registry_data_version" ("id", "version") VALUES (1, 0) ON CONFLICT ("id") DO NOTHING;
--> statement-breakpoint
CREATE OR REPLACE FUNCTION "bump_registry_data_version"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  UPDATE "registry_data_version" SET "version" = "version" + 1 WHERE "id" = 1;
  RETURN NULL;
END;
$$;
--> statement-breakpoint
DO $$
DECLARE t text;
BEGIN
  FOREACH t IN ARRAY ARRAY['episode', 'assessment', 'score', 'episode_intervention', 'registry_rules', 'clinic',
                           'instrument', 'intervention_code', 'condition'] LOOP
    EXECUTE format('CREATE TRIGGER %I AFTER INSERT OR UPDATE OR DELETE OR TRUNCATE ON %I
                    FOR EACH STATEMENT EXECUTE FUNCTION "bump_registry_data_version"()', t || '_bumps_data_version', t);
  END LOOP;
END;
$$;
