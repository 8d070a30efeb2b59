CREATE TYPE "public"."audit_action" AS ENUM('approve', 'request_changes', 'suspend', 'reinstate');--> statement-breakpoint
CREATE TYPE "public"."distance_unit" AS ENUM('mi', 'km');--> statement-breakpoint
CREATE TYPE "public"."document_kind" AS ENUM('licence', 'insurance');--> statement-breakpoint
CREATE TYPE "public"."service_kind" AS ENUM('layout_forms', 'base_prep', 'pour_finish', 'whole_job');--> statement-breakpoint
CREATE TABLE "audit_log" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"actor_id" uuid,
	"actor_name" text NOT NULL,
	"action" "audit_action" NOT NULL,
	"subject_id" uuid,
	"subject_name" text NOT NULL,
	"reason" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "contractor_document" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"contractor_id" uuid NOT NULL,
	"kind" "document_kind" NOT NULL,
	"storage_key" text NOT NULL,
	"content_type" text NOT NULL,
	"bytes" integer NOT NULL,
	"original_name" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "contractor_document_kind_uq" UNIQUE("contractor_id","kind")
);
--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "contact_name" text;--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "phone" text;--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "description" text;--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "years_in_trade" integer;--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "services" "service_kind"[] DEFAULT '{}' NOT NULL;--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "licence_number" text;--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "licence_authority" text;--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "service_postcode" text;--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "service_radius" integer;--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "service_radius_unit" "distance_unit" DEFAULT 'mi' NOT NULL;--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "service_lat" double precision;--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "service_lon" double precision;--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "submitted_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "contractor" ADD COLUMN "review_requested_at" timestamp with time zone DEFAULT now() NOT NULL;--> statement-breakpoint
ALTER TABLE "audit_log" ADD CONSTRAINT "audit_log_actor_id_user_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_log" ADD CONSTRAINT "audit_log_subject_id_user_id_fk" FOREIGN KEY ("subject_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contractor_document" ADD CONSTRAINT "contractor_document_contractor_id_contractor_user_id_fk" FOREIGN KEY ("contractor_id") REFERENCES "public"."contractor"("user_id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "audit_log_created_idx" ON "audit_log" USING btree ("created_at");--> statement-breakpoint
CREATE INDEX "audit_log_subject_idx" ON "audit_log" USING btree ("subject_id");--> statement-breakpoint
CREATE INDEX "contractor_status_idx" ON "contractor" USING btree ("status","review_requested_at");