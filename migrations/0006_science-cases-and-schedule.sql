CREATE TYPE "public"."science_case" AS ENUM('photometric-microlensing', 'astrometric-microlensing', 'resolved-images', 'time-delay', 'horizon-scale');--> statement-breakpoint
ALTER TABLE "proposals" ADD COLUMN "moon_min_separation_deg" double precision DEFAULT 30;--> statement-breakpoint
ALTER TABLE "proposals" ADD COLUMN "moon_max_illumination" double precision;--> statement-breakpoint
ALTER TABLE "proposals" ADD COLUMN "visit_minutes" double precision DEFAULT 20 NOT NULL;--> statement-breakpoint
ALTER TABLE "proposals" ADD COLUMN "clear_night_fraction" double precision DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE "proposals" ADD COLUMN "astrometric_precision_mas" double precision;--> statement-breakpoint
ALTER TABLE "proposals" ADD COLUMN "reachable_contrast" double precision;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "science_case" "science_case";--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "event_peak_jd_utc" double precision;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "source_radius_solar" double precision;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "source_radius_theta_e" double precision;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "limb_darkening_u" double precision;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "answered_case" "science_case";--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "case_verdict" "feasibility_verdict" DEFAULT 'unknown' NOT NULL;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "case_answers" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "derivation_version" integer DEFAULT 0 NOT NULL;