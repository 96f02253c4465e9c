ALTER TABLE "assessment" DROP CONSTRAINT "assessment_episode_id_episode_id_fk";
--> statement-breakpoint
ALTER TABLE "assessment" DROP CONSTRAINT "assessment_created_by_app_user_id_fk";
--> statement-breakpoint
ALTER TABLE "episode_intervention" DROP CONSTRAINT "episode_intervention_episode_id_episode_id_fk";
--> statement-breakpoint
ALTER TABLE "episode_intervention" DROP CONSTRAINT "episode_intervention_intervention_code_id_intervention_code_id_fk";
--> statement-breakpoint
ALTER TABLE "episode" DROP CONSTRAINT "episode_clinic_id_clinic_id_fk";
--> statement-breakpoint
ALTER TABLE "episode" DROP CONSTRAINT "episode_condition_code_condition_code_fk";
--> statement-breakpoint
ALTER TABLE "episode" DROP CONSTRAINT "episode_created_by_app_user_id_fk";
--> statement-breakpoint
ALTER TABLE "episode" DROP CONSTRAINT "episode_updated_by_app_user_id_fk";
--> statement-breakpoint
ALTER TABLE "score" DROP CONSTRAINT "score_assessment_id_assessment_id_fk";
--> statement-breakpoint
ALTER TABLE "score" DROP CONSTRAINT "score_instrument_id_instrument_id_fk";
