CREATE TYPE "public"."attachment_kind" AS ENUM('png', 'jpeg', 'pdf', 'fits');--> statement-breakpoint
CREATE TYPE "public"."import_format" AS ENUM('csv', 'votable');--> statement-breakpoint
CREATE TYPE "public"."upload_purpose" AS ENUM('target_list', 'note_attachment');--> statement-breakpoint
CREATE TABLE "imports" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"proposal_id" uuid NOT NULL,
	"file_id" uuid NOT NULL,
	"format" "import_format" NOT NULL,
	"mapping" jsonb NOT NULL,
	"fill" jsonb NOT NULL,
	"tolerance_arcsec" double precision NOT NULL,
	"added_count" integer NOT NULL,
	"updated_count" integer NOT NULL,
	"skipped_count" integer NOT NULL,
	"imported_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "note_attachments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"note_id" uuid NOT NULL,
	"file_id" uuid NOT NULL,
	"kind" "attachment_kind" NOT NULL,
	"fits_header" jsonb,
	"size_bytes" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "uploaded_files" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"key" text NOT NULL,
	"name" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"content_type" text NOT NULL,
	"proposal_id" uuid NOT NULL,
	"uploaded_by" uuid,
	"purpose" "upload_purpose" NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "imports" ADD CONSTRAINT "imports_proposal_id_proposals_id_fk" FOREIGN KEY ("proposal_id") REFERENCES "public"."proposals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "imports" ADD CONSTRAINT "imports_file_id_uploaded_files_id_fk" FOREIGN KEY ("file_id") REFERENCES "public"."uploaded_files"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "imports" ADD CONSTRAINT "imports_imported_by_users_id_fk" FOREIGN KEY ("imported_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "note_attachments" ADD CONSTRAINT "note_attachments_note_id_notes_id_fk" FOREIGN KEY ("note_id") REFERENCES "public"."notes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "note_attachments" ADD CONSTRAINT "note_attachments_file_id_uploaded_files_id_fk" FOREIGN KEY ("file_id") REFERENCES "public"."uploaded_files"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "uploaded_files" ADD CONSTRAINT "uploaded_files_proposal_id_proposals_id_fk" FOREIGN KEY ("proposal_id") REFERENCES "public"."proposals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "uploaded_files" ADD CONSTRAINT "uploaded_files_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "imports_proposal_idx" ON "imports" USING btree ("proposal_id","created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "note_attachments_file_key" ON "note_attachments" USING btree ("file_id");--> statement-breakpoint
CREATE INDEX "note_attachments_note_idx" ON "note_attachments" USING btree ("note_id");--> statement-breakpoint
CREATE UNIQUE INDEX "uploaded_files_key_key" ON "uploaded_files" USING btree ("key");--> statement-breakpoint
CREATE INDEX "uploaded_files_proposal_idx" ON "uploaded_files" USING btree ("proposal_id");