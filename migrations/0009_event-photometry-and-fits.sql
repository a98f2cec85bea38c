CREATE TYPE "public"."target_revision_kind" AS ENUM('light_curve_fit', 'undo');--> statement-breakpoint
ALTER TYPE "public"."upload_purpose" ADD VALUE 'event_photometry';--> statement-breakpoint
CREATE TABLE "event_photometry" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"target_id" uuid NOT NULL,
	"file_id" uuid NOT NULL,
	"mapping" jsonb NOT NULL,
	"datasets" jsonb NOT NULL,
	"times_jd_utc" double precision[] NOT NULL,
	"fluxes" double precision[] NOT NULL,
	"flux_errors" double precision[] NOT NULL,
	"dataset_indices" integer[] NOT NULL,
	"refused_rows" integer[] DEFAULT '{}'::integer[] NOT NULL,
	"added_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "target_revisions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"target_id" uuid NOT NULL,
	"kind" "target_revision_kind" NOT NULL,
	"before" jsonb NOT NULL,
	"after" jsonb NOT NULL,
	"summary" jsonb,
	"undoes" uuid,
	"undone_at" timestamp with time zone,
	"actor_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "einstein_time_days" double precision;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "parallax_north" double precision;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "parallax_east" double precision;--> statement-breakpoint
ALTER TABLE "event_photometry" ADD CONSTRAINT "event_photometry_target_id_targets_id_fk" FOREIGN KEY ("target_id") REFERENCES "public"."targets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "event_photometry" ADD CONSTRAINT "event_photometry_file_id_uploaded_files_id_fk" FOREIGN KEY ("file_id") REFERENCES "public"."uploaded_files"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "event_photometry" ADD CONSTRAINT "event_photometry_added_by_users_id_fk" FOREIGN KEY ("added_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "target_revisions" ADD CONSTRAINT "target_revisions_target_id_targets_id_fk" FOREIGN KEY ("target_id") REFERENCES "public"."targets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "target_revisions" ADD CONSTRAINT "target_revisions_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "event_photometry_file_key" ON "event_photometry" USING btree ("file_id");--> statement-breakpoint
CREATE INDEX "event_photometry_target_idx" ON "event_photometry" USING btree ("target_id","created_at");--> statement-breakpoint
CREATE INDEX "target_revisions_target_idx" ON "target_revisions" USING btree ("target_id","created_at");