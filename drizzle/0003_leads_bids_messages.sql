CREATE TYPE "public"."bid_status" AS ENUM('open', 'accepted', 'not_selected', 'withdrawn');--> statement-breakpoint
CREATE TYPE "public"."lead_status" AS ENUM('new', 'viewed', 'bid_sent', 'declined', 'won', 'not_selected', 'withdrawn');--> statement-breakpoint
CREATE TYPE "public"."timeframe" AS ENUM('soon', 'within_month', 'within_season', 'flexible');--> statement-breakpoint
CREATE TABLE "bid" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"lead_id" uuid NOT NULL,
	"plan_id" uuid NOT NULL,
	"contractor_id" uuid NOT NULL,
	"total_cents" integer NOT NULL,
	"line_items" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"earliest_start" date NOT NULL,
	"duration_days" integer NOT NULL,
	"valid_until" date NOT NULL,
	"inclusions" text DEFAULT '' NOT NULL,
	"exclusions" text DEFAULT '' NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"status" "bid_status" DEFAULT 'open' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "bid_lead_id_unique" UNIQUE("lead_id")
);
--> statement-breakpoint
CREATE TABLE "lead" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"plan_id" uuid NOT NULL,
	"homeowner_id" uuid NOT NULL,
	"contractor_id" uuid NOT NULL,
	"scope" "service_kind" NOT NULL,
	"timeframe" timeframe NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"plan_revision" integer NOT NULL,
	"snapshot" jsonb NOT NULL,
	"latest_revision" integer NOT NULL,
	"town" text,
	"distance_km" double precision NOT NULL,
	"status" "lead_status" DEFAULT 'new' NOT NULL,
	"decline_reason" text,
	"homeowner_read_at" timestamp with time zone DEFAULT now() NOT NULL,
	"contractor_read_at" timestamp with time zone,
	"sent_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "lead_plan_contractor_uq" UNIQUE("plan_id","contractor_id")
);
--> statement-breakpoint
CREATE TABLE "lead_message" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"lead_id" uuid NOT NULL,
	"sender_id" uuid NOT NULL,
	"body" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "bid" ADD CONSTRAINT "bid_lead_id_lead_id_fk" FOREIGN KEY ("lead_id") REFERENCES "public"."lead"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bid" ADD CONSTRAINT "bid_plan_id_plan_id_fk" FOREIGN KEY ("plan_id") REFERENCES "public"."plan"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bid" ADD CONSTRAINT "bid_contractor_id_contractor_user_id_fk" FOREIGN KEY ("contractor_id") REFERENCES "public"."contractor"("user_id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lead" ADD CONSTRAINT "lead_plan_id_plan_id_fk" FOREIGN KEY ("plan_id") REFERENCES "public"."plan"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lead" ADD CONSTRAINT "lead_homeowner_id_user_id_fk" FOREIGN KEY ("homeowner_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lead" ADD CONSTRAINT "lead_contractor_id_contractor_user_id_fk" FOREIGN KEY ("contractor_id") REFERENCES "public"."contractor"("user_id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lead_message" ADD CONSTRAINT "lead_message_lead_id_lead_id_fk" FOREIGN KEY ("lead_id") REFERENCES "public"."lead"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lead_message" ADD CONSTRAINT "lead_message_sender_id_user_id_fk" FOREIGN KEY ("sender_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "bid_plan_idx" ON "bid" USING btree ("plan_id","status");--> statement-breakpoint
CREATE INDEX "lead_contractor_idx" ON "lead" USING btree ("contractor_id","sent_at");--> statement-breakpoint
CREATE INDEX "lead_message_lead_idx" ON "lead_message" USING btree ("lead_id","created_at");