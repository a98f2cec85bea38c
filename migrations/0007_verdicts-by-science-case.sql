ALTER TABLE "targets" DROP COLUMN "resolution_verdict";--> statement-breakpoint
ALTER TABLE "targets" DROP COLUMN "cadence_verdict";--> statement-breakpoint
ALTER TABLE "targets" DROP COLUMN "campaign_verdict";