CREATE TABLE "registry_data_change" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
DROP TABLE "registry_data_version" CASCADE;--> statement-breakpoint
-- The triggers of 0008 stay; their function now appends a row instead of updating one shared row, so writers
-- never wait on each other's open transactions (a long upload used to hold that row's lock to its commit).
CREATE OR REPLACE FUNCTION "bump_registry_data_version"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  INSERT INTO "registry_data_change" DEFAULT VALUES;
  RETURN NULL;
END;
$$;
