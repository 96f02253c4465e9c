CREATE TABLE "condition" (
	"code" text PRIMARY KEY NOT NULL,
	"label" text NOT NULL,
	"icd10" text NOT NULL
);
--> statement-breakpoint
CREATE TABLE "instrument" (
	"id" serial PRIMARY KEY NOT NULL,
	"code" text NOT NULL,
	"label" text NOT NULL,
	"unit" text NOT NULL,
	"min" numeric NOT NULL,
	"max" numeric NOT NULL,
	"higher_is_better" boolean NOT NULL,
	"mcid" numeric,
	"mcid_source" text NOT NULL,
	"body_region" text NOT NULL,
	"retired" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "instrument_code_unique" UNIQUE("code")
);
--> statement-breakpoint
CREATE TABLE "intervention_code" (
	"id" serial PRIMARY KEY NOT NULL,
	"code" text NOT NULL,
	"label" text NOT NULL,
	"kind" text NOT NULL,
	"graded" boolean DEFAULT false NOT NULL,
	"proposed_by_clinic_id" integer,
	"status" text DEFAULT 'accepted' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "intervention_code_code_unique" UNIQUE("code")
);
--> statement-breakpoint
CREATE TABLE "assessment" (
	"id" serial PRIMARY KEY NOT NULL,
	"episode_id" integer NOT NULL,
	"assessed_on" date NOT NULL,
	"timepoint" text NOT NULL,
	"reporter" text NOT NULL,
	"avg_daily_steps" integer,
	"adverse_event" text,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "episode_intervention" (
	"episode_id" integer NOT NULL,
	"intervention_code_id" integer NOT NULL,
	"start_week" integer DEFAULT 0 NOT NULL,
	"max_level" integer,
	CONSTRAINT "episode_intervention_episode_id_intervention_code_id_pk" PRIMARY KEY("episode_id","intervention_code_id"),
	CONSTRAINT "episode_intervention_level" CHECK ("episode_intervention"."max_level" is null or "episode_intervention"."max_level" between 1 and 3)
);
--> statement-breakpoint
CREATE TABLE "episode" (
	"id" serial PRIMARY KEY NOT NULL,
	"clinic_id" integer NOT NULL,
	"pseudonym" char(64) NOT NULL,
	"reference" text NOT NULL,
	"condition_code" text NOT NULL,
	"side" text NOT NULL,
	"start_date" date NOT NULL,
	"symptom_weeks" integer NOT NULL,
	"age_years" integer NOT NULL,
	"sex" text NOT NULL,
	"height_cm" numeric NOT NULL,
	"weight_kg" numeric NOT NULL,
	"activity_profile" text NOT NULL,
	"standing_work" boolean NOT NULL,
	"research_consent" boolean NOT NULL,
	"status" text DEFAULT 'open' NOT NULL,
	"discharge_date" date,
	"discharge_reason" text,
	"version" integer DEFAULT 1 NOT NULL,
	"created_by" integer,
	"updated_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "episode_pseudonym_hex" CHECK ("episode"."pseudonym" ~ '^[0-9a-f]{64}$')
);
--> statement-breakpoint
CREATE TABLE "score" (
	"assessment_id" integer NOT NULL,
	"instrument_id" integer NOT NULL,
	"value" numeric NOT NULL,
	CONSTRAINT "score_assessment_id_instrument_id_pk" PRIMARY KEY("assessment_id","instrument_id")
);
--> statement-breakpoint
CREATE TABLE "audit_event" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"actor_id" integer,
	"clinic_id" integer,
	"action" text NOT NULL,
	"entity" text NOT NULL,
	"entity_id" text,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"detail" jsonb DEFAULT '{}'::jsonb NOT NULL
);
--> statement-breakpoint
CREATE TABLE "registry_rules" (
	"version" serial PRIMARY KEY NOT NULL,
	"rules" jsonb NOT NULL,
	"reason" text NOT NULL,
	"changed_by" integer,
	"changed_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "upload" (
	"id" serial PRIMARY KEY NOT NULL,
	"clinic_id" integer NOT NULL,
	"user_id" integer,
	"file_name" text NOT NULL,
	"file_sha256" text NOT NULL,
	"row_count" integer NOT NULL,
	"accepted" integer NOT NULL,
	"rejected" integer NOT NULL,
	"status" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "intervention_code" ADD CONSTRAINT "intervention_code_proposed_by_clinic_id_clinic_id_fk" FOREIGN KEY ("proposed_by_clinic_id") REFERENCES "public"."clinic"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assessment" ADD CONSTRAINT "assessment_episode_id_episode_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episode"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "assessment" ADD CONSTRAINT "assessment_created_by_app_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."app_user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "episode_intervention" ADD CONSTRAINT "episode_intervention_episode_id_episode_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episode"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "episode_intervention" ADD CONSTRAINT "episode_intervention_intervention_code_id_intervention_code_id_fk" FOREIGN KEY ("intervention_code_id") REFERENCES "public"."intervention_code"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "episode" ADD CONSTRAINT "episode_clinic_id_clinic_id_fk" FOREIGN KEY ("clinic_id") REFERENCES "public"."clinic"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "episode" ADD CONSTRAINT "episode_condition_code_condition_code_fk" FOREIGN KEY ("condition_code") REFERENCES "public"."condition"("code") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "episode" ADD CONSTRAINT "episode_created_by_app_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."app_user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "episode" ADD CONSTRAINT "episode_updated_by_app_user_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."app_user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "score" ADD CONSTRAINT "score_assessment_id_assessment_id_fk" FOREIGN KEY ("assessment_id") REFERENCES "public"."assessment"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "score" ADD CONSTRAINT "score_instrument_id_instrument_id_fk" FOREIGN KEY ("instrument_id") REFERENCES "public"."instrument"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_event" ADD CONSTRAINT "audit_event_actor_id_app_user_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."app_user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_event" ADD CONSTRAINT "audit_event_clinic_id_clinic_id_fk" FOREIGN KEY ("clinic_id") REFERENCES "public"."clinic"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "registry_rules" ADD CONSTRAINT "registry_rules_changed_by_app_user_id_fk" FOREIGN KEY ("changed_by") REFERENCES "public"."app_user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "upload" ADD CONSTRAINT "upload_clinic_id_clinic_id_fk" FOREIGN KEY ("clinic_id") REFERENCES "public"."clinic"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "upload" ADD CONSTRAINT "upload_user_id_app_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."app_user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "assessment_one_baseline_uq" ON "assessment" USING btree ("episode_id") WHERE "assessment"."timepoint" = 'baseline';--> statement-breakpoint
CREATE UNIQUE INDEX "assessment_natural_key_uq" ON "assessment" USING btree ("episode_id","assessed_on","timepoint");--> statement-breakpoint
CREATE UNIQUE INDEX "episode_clinic_reference_uq" ON "episode" USING btree ("clinic_id","reference");--> statement-breakpoint
CREATE INDEX "episode_clinic_start_idx" ON "episode" USING btree ("clinic_id","start_date");--> statement-breakpoint
CREATE INDEX "score_instrument_idx" ON "score" USING btree ("instrument_id");--> statement-breakpoint
CREATE INDEX "audit_event_at_idx" ON "audit_event" USING btree ("at");--> statement-breakpoint
CREATE INDEX "audit_event_clinic_idx" ON "audit_event" USING btree ("clinic_id","at");