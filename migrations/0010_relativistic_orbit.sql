ALTER TYPE "public"."science_case" ADD VALUE 'relativistic-orbit';--> statement-breakpoint
ALTER TABLE "proposals" ADD COLUMN "spectroscopic_precision_km_per_s" double precision;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "orbit_semi_major_axis_au" double precision;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "orbit_semi_major_axis_mas" double precision;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "orbit_eccentricity" double precision;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "orbit_period_days" double precision;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "orbit_periapsis_jd_utc" double precision;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "orbit_inclination_deg" double precision;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "orbit_node_deg" double precision;--> statement-breakpoint
ALTER TABLE "targets" ADD COLUMN "orbit_periapsis_argument_deg" double precision;