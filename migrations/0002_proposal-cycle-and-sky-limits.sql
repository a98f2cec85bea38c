ALTER TABLE "proposals" ADD COLUMN "cycle_start_date" date;--> statement-breakpoint
ALTER TABLE "proposals" ADD COLUMN "cycle_end_date" date;--> statement-breakpoint
ALTER TABLE "proposals" ADD COLUMN "airmass_limit" double precision DEFAULT 2 NOT NULL;--> statement-breakpoint
ALTER TABLE "proposals" ADD COLUMN "interferometer_wavelength_mm" double precision;--> statement-breakpoint
ALTER TABLE "proposals" ADD COLUMN "interferometer_baseline_km" double precision;