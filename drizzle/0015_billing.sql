CREATE TYPE "public"."billing_status" AS ENUM('none', 'active', 'past_due', 'cancelled');--> statement-breakpoint
CREATE TABLE "billing_account" (
	"contractor_id" uuid PRIMARY KEY NOT NULL,
	"customer_id" text,
	"subscription_id" text,
	"status" "billing_status" DEFAULT 'none' NOT NULL,
	"cancel_at_period_end" boolean DEFAULT false NOT NULL,
	"period_start" timestamp with time zone,
	"period_end" timestamp with time zone,
	"leads_used" integer DEFAULT 0 NOT NULL,
	"credits" integer DEFAULT 0 NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "billing_account_customer_id_unique" UNIQUE("customer_id")
);
--> statement-breakpoint
CREATE TABLE "billing_event" (
	"id" text PRIMARY KEY NOT NULL,
	"type" text NOT NULL,
	"contractor_id" uuid,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "lead_charge" (
	"lead_id" uuid PRIMARY KEY NOT NULL,
	"contractor_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"period_start" timestamp with time zone,
	"charged_at" timestamp with time zone DEFAULT now() NOT NULL,
	"refunded_at" timestamp with time zone,
	"refund_reason" text
);
--> statement-breakpoint
ALTER TABLE "billing_account" ADD CONSTRAINT "billing_account_contractor_id_contractor_user_id_fk" FOREIGN KEY ("contractor_id") REFERENCES "public"."contractor"("user_id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "billing_event" ADD CONSTRAINT "billing_event_contractor_id_contractor_user_id_fk" FOREIGN KEY ("contractor_id") REFERENCES "public"."contractor"("user_id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lead_charge" ADD CONSTRAINT "lead_charge_lead_id_lead_id_fk" FOREIGN KEY ("lead_id") REFERENCES "public"."lead"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lead_charge" ADD CONSTRAINT "lead_charge_contractor_id_contractor_user_id_fk" FOREIGN KEY ("contractor_id") REFERENCES "public"."contractor"("user_id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "lead_charge_contractor_idx" ON "lead_charge" USING btree ("contractor_id","charged_at");