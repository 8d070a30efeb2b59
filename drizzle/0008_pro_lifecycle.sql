ALTER TYPE "public"."contractor_status" ADD VALUE 'lapsed';--> statement-breakpoint
ALTER TYPE "public"."bid_status" ADD VALUE 'closed';--> statement-breakpoint
ALTER TYPE "public"."lead_status" ADD VALUE 'expired';--> statement-breakpoint
ALTER TYPE "public"."lead_status" ADD VALUE 'closed';--> statement-breakpoint
ALTER TYPE "public"."lead_status" ADD VALUE 'done';--> statement-breakpoint
CREATE TABLE "credential_reminder" (
	"contractor_id" uuid NOT NULL,
	"kind" "document_kind" NOT NULL,
	"expires_on" date NOT NULL,
	"days_before" integer NOT NULL,
	"sent_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "credential_reminder_contractor_id_kind_expires_on_days_before_pk" PRIMARY KEY("contractor_id","kind","expires_on","days_before")
);
--> statement-breakpoint
CREATE TABLE "job_contact" (
	"plan_id" uuid PRIMARY KEY NOT NULL,
	"site_address" text NOT NULL,
	"phone" text NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "lead" ADD COLUMN "respond_by" date;--> statement-breakpoint
ALTER TABLE "credential_reminder" ADD CONSTRAINT "credential_reminder_contractor_id_contractor_user_id_fk" FOREIGN KEY ("contractor_id") REFERENCES "public"."contractor"("user_id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "job_contact" ADD CONSTRAINT "job_contact_plan_id_plan_id_fk" FOREIGN KEY ("plan_id") REFERENCES "public"."plan"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "contractor" DROP COLUMN "expiry_reminder_days";