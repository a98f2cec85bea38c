ALTER TABLE "proposals" ADD COLUMN "photometry" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "source_magnitude" double precision;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "source_band" text;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "blend_fraction" double precision;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "time_request_hours" double precision;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "peak_signal_to_noise" double precision;