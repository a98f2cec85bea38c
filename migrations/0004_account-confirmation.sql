ALTER TYPE "public"."auth_token_purpose" ADD VALUE 'account_confirmation';--> statement-breakpoint
ALTER TABLE "users" ADD COLUMN "email_confirmed_at" timestamp with time zone DEFAULT now();