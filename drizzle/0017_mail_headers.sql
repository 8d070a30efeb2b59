ALTER TABLE "dev_mail" ADD COLUMN "headers" jsonb;--> statement-breakpoint
ALTER TABLE "mail_outbox" ADD COLUMN "headers" jsonb;