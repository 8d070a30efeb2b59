ALTER TYPE "public"."token_purpose" ADD VALUE 'change_email';--> statement-breakpoint
ALTER TYPE "public"."audit_action" ADD VALUE 'disable_account';--> statement-breakpoint
ALTER TYPE "public"."audit_action" ADD VALUE 'enable_account';--> statement-breakpoint
ALTER TABLE "email_token" ADD COLUMN "new_email" text;--> statement-breakpoint
ALTER TABLE "user" ADD COLUMN "disabled_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "user" ADD COLUMN "disabled_reason" text;--> statement-breakpoint
ALTER TABLE "user" ADD COLUMN "mail_opt_out" text[] DEFAULT '{}' NOT NULL;--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "distance_unit" "distance_unit";