CREATE TABLE "cohort_version" (
	"id" serial PRIMARY KEY NOT NULL,
	"cohort_id" integer NOT NULL,
	"version" integer NOT NULL,
	"criteria" jsonb NOT NULL,
	"count_at_save" integer NOT NULL,
	"clinics_at_save" integer NOT NULL,
	"rules_version" integer NOT NULL,
	"saved_by" integer NOT NULL,
	"saved_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "cohort" (
	"id" serial PRIMARY KEY NOT NULL,
	"owner_id" integer NOT NULL,
	"name" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"current_version" integer DEFAULT 1 NOT NULL,
	"duplicated_from_id" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "data_request" (
	"id" serial PRIMARY KEY NOT NULL,
	"cohort_version_id" integer NOT NULL,
	"requester_id" integer NOT NULL,
	"purpose" text NOT NULL,
	"variable_groups" jsonb NOT NULL,
	"status" text DEFAULT 'pending' NOT NULL,
	"decided_by" integer,
	"decided_at" timestamp with time zone,
	"decline_reason" text,
	"expires_on" date,
	"start_granularity" text,
	"allow_raw_bmi" boolean DEFAULT false NOT NULL,
	"k" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "data_request_k_min" CHECK ("data_request"."k" is null or "data_request"."k" >= 3)
);
--> statement-breakpoint
CREATE TABLE "export_log" (
	"id" serial PRIMARY KEY NOT NULL,
	"request_id" integer NOT NULL,
	"user_id" integer NOT NULL,
	"status" text NOT NULL,
	"row_count" integer NOT NULL,
	"generalised_rows" integer NOT NULL,
	"suppressed_rows" integer NOT NULL,
	"k" integer NOT NULL,
	"byte_count" integer NOT NULL,
	"sha256" text NOT NULL,
	"started_at" timestamp with time zone NOT NULL,
	"finished_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "cohort_version" ADD CONSTRAINT "cohort_version_cohort_id_cohort_id_fk" FOREIGN KEY ("cohort_id") REFERENCES "public"."cohort"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cohort_version" ADD CONSTRAINT "cohort_version_saved_by_app_user_id_fk" FOREIGN KEY ("saved_by") REFERENCES "public"."app_user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cohort" ADD CONSTRAINT "cohort_owner_id_app_user_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."app_user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "data_request" ADD CONSTRAINT "data_request_cohort_version_id_cohort_version_id_fk" FOREIGN KEY ("cohort_version_id") REFERENCES "public"."cohort_version"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "data_request" ADD CONSTRAINT "data_request_requester_id_app_user_id_fk" FOREIGN KEY ("requester_id") REFERENCES "public"."app_user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "data_request" ADD CONSTRAINT "data_request_decided_by_app_user_id_fk" FOREIGN KEY ("decided_by") REFERENCES "public"."app_user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "export_log" ADD CONSTRAINT "export_log_request_id_data_request_id_fk" FOREIGN KEY ("request_id") REFERENCES "public"."data_request"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "export_log" ADD CONSTRAINT "export_log_user_id_app_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."app_user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "cohort_version_uq" ON "cohort_version" USING btree ("cohort_id","version");--> statement-breakpoint
CREATE INDEX "cohort_owner_idx" ON "cohort" USING btree ("owner_id");--> statement-breakpoint
CREATE INDEX "data_request_requester_idx" ON "data_request" USING btree ("requester_id");--> statement-breakpoint
CREATE INDEX "export_log_request_idx" ON "export_log" USING btree ("request_id");--> statement-breakpoint
CREATE INDEX "export_log_finished_idx" ON "export_log" USING btree ("finished_at");