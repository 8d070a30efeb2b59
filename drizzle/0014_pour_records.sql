CREATE TABLE "pour_record" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"plan_id" uuid NOT NULL,
	"key" text NOT NULL,
	"kind" text NOT NULL,
	"pour" integer,
	"at" timestamp with time zone NOT NULL,
	"record" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "pour_record" ADD CONSTRAINT "pour_record_plan_id_plan_id_fk" FOREIGN KEY ("plan_id") REFERENCES "public"."plan"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "pour_record_plan_key_idx" ON "pour_record" USING btree ("plan_id","key");--> statement-breakpoint
CREATE INDEX "pour_record_plan_at_idx" ON "pour_record" USING btree ("plan_id","at");