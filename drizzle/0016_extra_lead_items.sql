ALTER TABLE "lead_charge" ADD COLUMN "invoice_item_id" text;--> statement-breakpoint
ALTER TABLE "lead_charge" ADD COLUMN "extra_state" text;