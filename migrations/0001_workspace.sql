CREATE TYPE "public"."auth_token_purpose" AS ENUM('password_reset', 'sign_in_link');--> statement-breakpoint
CREATE TYPE "public"."lens_model" AS ENUM('point', 'sis');--> statement-breakpoint
CREATE TYPE "public"."proposal_role" AS ENUM('pi', 'coi', 'viewer');--> statement-breakpoint
CREATE TYPE "public"."site_role" AS ENUM('admin', 'member');--> statement-breakpoint
CREATE TYPE "public"."target_status" AS ENUM('candidate', 'accepted', 'scheduled', 'observed', 'dropped');--> statement-breakpoint
CREATE TYPE "public"."feasibility_verdict" AS ENUM('feasible', 'marginal', 'infeasible', 'unknown');--> statement-breakpoint
CREATE TABLE "activity" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"proposal_id" uuid NOT NULL,
	"actor_id" uuid,
	"action" text NOT NULL,
	"subject" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "auth_tokens" (
	"token_hash" text PRIMARY KEY NOT NULL,
	"user_id" uuid NOT NULL,
	"purpose" "auth_token_purpose" NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"used_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "invitations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"proposal_id" uuid NOT NULL,
	"email" text NOT NULL,
	"role" "proposal_role" NOT NULL,
	"token_hash" text NOT NULL,
	"invited_by" uuid,
	"expires_at" timestamp with time zone NOT NULL,
	"accepted_at" timestamp with time zone,
	"accepted_by" uuid,
	"revoked_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "note_revisions" (
	"note_id" uuid NOT NULL,
	"version" integer NOT NULL,
	"body" text NOT NULL,
	"edited_by" uuid,
	"edited_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "note_revisions_note_id_version_pk" PRIMARY KEY("note_id","version")
);
--> statement-breakpoint
CREATE TABLE "notes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"target_id" uuid NOT NULL,
	"author_id" uuid,
	"body" text NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"updated_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "proposal_members" (
	"proposal_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"role" "proposal_role" NOT NULL,
	"joined_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "proposal_members_proposal_id_user_id_pk" PRIMARY KEY("proposal_id","user_id")
);
--> statement-breakpoint
CREATE TABLE "proposals" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"title" text NOT NULL,
	"cycle" text NOT NULL,
	"abstract" text DEFAULT '' NOT NULL,
	"site_name" text NOT NULL,
	"site_latitude_deg" double precision NOT NULL,
	"site_longitude_deg" double precision NOT NULL,
	"site_elevation_m" double precision NOT NULL,
	"site_horizon_limit_deg" double precision NOT NULL,
	"resolution_mas" double precision NOT NULL,
	"cadence_hours" double precision NOT NULL,
	"campaign_length_days" double precision NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "rate_limit_counters" (
	"bucket" text NOT NULL,
	"window_start" timestamp with time zone NOT NULL,
	"hits" integer DEFAULT 0 NOT NULL,
	CONSTRAINT "rate_limit_counters_bucket_window_start_pk" PRIMARY KEY("bucket","window_start")
);
--> statement-breakpoint
CREATE TABLE "targets" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"proposal_id" uuid NOT NULL,
	"name" text NOT NULL,
	"ra_deg" double precision NOT NULL,
	"dec_deg" double precision NOT NULL,
	"lens_model" "lens_model" NOT NULL,
	"lens_mass_solar" double precision,
	"velocity_dispersion_km_per_s" double precision,
	"lens_distance_pc" double precision,
	"source_distance_pc" double precision,
	"lens_redshift" double precision,
	"source_redshift" double precision,
	"source_offset_theta_e" double precision NOT NULL,
	"proper_motion_mas_per_yr" double precision,
	"priority" integer NOT NULL,
	"status" "target_status" DEFAULT 'candidate' NOT NULL,
	"tags" text[] DEFAULT '{}'::text[] NOT NULL,
	"einstein_radius_mas" double precision,
	"image_separation_mas" double precision,
	"magnification_total" double precision,
	"time_delay_days" double precision,
	"crossing_time_days" double precision,
	"shadow_diameter_microarcsec" double precision,
	"resolution_verdict" "feasibility_verdict" DEFAULT 'unknown' NOT NULL,
	"cadence_verdict" "feasibility_verdict" DEFAULT 'unknown' NOT NULL,
	"campaign_verdict" "feasibility_verdict" DEFAULT 'unknown' NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "users" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"email" text NOT NULL,
	"name" text NOT NULL,
	"password_hash" text,
	"site_role" "site_role" DEFAULT 'member' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "users_email_lower" CHECK ("users"."email" = lower("users"."email"))
);
--> statement-breakpoint
ALTER TABLE "activity" ADD CONSTRAINT "activity_proposal_id_proposals_id_fk" FOREIGN KEY ("proposal_id") REFERENCES "public"."proposals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "activity" ADD CONSTRAINT "activity_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "auth_tokens" ADD CONSTRAINT "auth_tokens_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_proposal_id_proposals_id_fk" FOREIGN KEY ("proposal_id") REFERENCES "public"."proposals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_invited_by_users_id_fk" FOREIGN KEY ("invited_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_accepted_by_users_id_fk" FOREIGN KEY ("accepted_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "note_revisions" ADD CONSTRAINT "note_revisions_note_id_notes_id_fk" FOREIGN KEY ("note_id") REFERENCES "public"."notes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "note_revisions" ADD CONSTRAINT "note_revisions_edited_by_users_id_fk" FOREIGN KEY ("edited_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notes" ADD CONSTRAINT "notes_target_id_targets_id_fk" FOREIGN KEY ("target_id") REFERENCES "public"."targets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notes" ADD CONSTRAINT "notes_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notes" ADD CONSTRAINT "notes_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_members" ADD CONSTRAINT "proposal_members_proposal_id_proposals_id_fk" FOREIGN KEY ("proposal_id") REFERENCES "public"."proposals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposal_members" ADD CONSTRAINT "proposal_members_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "proposals" ADD CONSTRAINT "proposals_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "targets" ADD CONSTRAINT "targets_proposal_id_proposals_id_fk" FOREIGN KEY ("proposal_id") REFERENCES "public"."proposals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "targets" ADD CONSTRAINT "targets_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "activity_proposal_idx" ON "activity" USING btree ("proposal_id","id");--> statement-breakpoint
CREATE INDEX "auth_tokens_user_idx" ON "auth_tokens" USING btree ("user_id");--> statement-breakpoint
CREATE UNIQUE INDEX "invitations_token_key" ON "invitations" USING btree ("token_hash");--> statement-breakpoint
CREATE INDEX "invitations_proposal_idx" ON "invitations" USING btree ("proposal_id");--> statement-breakpoint
CREATE INDEX "notes_target_idx" ON "notes" USING btree ("target_id");--> statement-breakpoint
CREATE INDEX "proposal_members_user_idx" ON "proposal_members" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "targets_proposal_name_idx" ON "targets" USING btree ("proposal_id","name");--> statement-breakpoint
CREATE INDEX "targets_proposal_einstein_idx" ON "targets" USING btree ("proposal_id","einstein_radius_mas");--> statement-breakpoint
CREATE INDEX "targets_proposal_priority_idx" ON "targets" USING btree ("proposal_id","priority");--> statement-breakpoint
CREATE UNIQUE INDEX "users_email_key" ON "users" USING btree ("email");