CREATE TABLE "registry_data_version" (
	"id" integer PRIMARY KEY DEFAULT 1 NOT NULL,
	"version" bigint DEFAULT 0 NOT NULL,
	CONSTRAINT "registry_data_version_single_row" CHECK ("registry_data_version"."id" = 1)
);
