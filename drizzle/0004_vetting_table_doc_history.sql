ALTER TYPE "public"."bid_status" ADD VALUE 'released';--> statement-breakpoint
ALTER TYPE "public"."lead_status" ADD VALUE 'released';--> statement-breakpoint
ALTER TABLE "contractor_document" DROP CONSTRAINT "contractor_document_kind_uq";--> statement-breakpoint
ALTER TYPE "public"."audit_action" RENAME VALUE 'request_changes' TO 'send_back';--> statement-breakpoint
ALTER TYPE "public"."contractor_status" RENAME TO "contractor_status_old";--> statement-breakpoint
CREATE TYPE "public"."contractor_status" AS ENUM('draft', 'awaiting_review', 'approved', 'sent_back', 'suspended');--> statement-breakpoint
ALTER TABLE "contractor" ALTER COLUMN "status" DROP DEFAULT;--> statement-breakpoint
ALTER TABLE "contractor" ALTER COLUMN "status" SET DATA TYPE "public"."contractor_status" USING (CASE
	WHEN "status"::text = 'changes_requested' THEN 'sent_back'
	WHEN "status"::text = 'awaiting_review' AND "submitted_at" IS NULL THEN 'draft'
	ELSE "status"::text END)::"public"."contractor_status";--> statement-breakpoint
ALTER TABLE "contractor" ALTER COLUMN "status" SET DEFAULT 'draft';--> statement-breakpoint
DROP TYPE "public"."contractor_status_old";--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "suspended_from" "contractor_status";--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "credentials_changed_while_suspended" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "reviewed_snapshot" jsonb;--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "licence_expires_on" date;--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "insurance_expires_on" date;--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "expiry_reminder_days" integer;--> statement-breakpoint
ALTER TABLE "contractor_document" ADD COLUMN "superseded_at" timestamp with time zone;--> statement-breakpoint
CREATE UNIQUE INDEX "contractor_document_current_uq" ON "contractor_document" USING btree ("contractor_id","kind") WHERE "contractor_document"."superseded_at" is null;
