CREATE TABLE "reminder_digest" (
	"id" serial PRIMARY KEY NOT NULL,
	"user_id" integer NOT NULL,
	"day" date NOT NULL,
	"due_count" integer NOT NULL,
	"closing_count" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "self_report_link" (
	"id" serial PRIMARY KEY NOT NULL,
	"episode_id" integer NOT NULL,
	"timepoint" text NOT NULL,
	"token_hash" char(64) NOT NULL,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"used_at" timestamp with time zone,
	"assessment_id" integer,
	CONSTRAINT "self_report_link_hash_hex" CHECK ("self_report_link"."token_hash" ~ '^[0-9a-f]{64}$')
);
--> statement-breakpoint
ALTER TABLE "reminder_digest" ADD CONSTRAINT "reminder_digest_user_id_app_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."app_user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "self_report_link" ADD CONSTRAINT "self_report_link_episode_id_episode_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episode"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "self_report_link" ADD CONSTRAINT "self_report_link_created_by_app_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."app_user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "self_report_link" ADD CONSTRAINT "self_report_link_assessment_id_assessment_id_fk" FOREIGN KEY ("assessment_id") REFERENCES "public"."assessment"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "reminder_digest_user_day_uq" ON "reminder_digest" USING btree ("user_id","day");--> statement-breakpoint
CREATE UNIQUE INDEX "self_report_link_token_uq" ON "self_report_link" USING btree ("token_hash");--> statement-breakpoint
CREATE INDEX "self_report_link_episode_idx" ON "self_report_link" USING btree ("episode_id");