CREATE TABLE "app_secret" (
	"name" text PRIMARY KEY NOT NULL,
	"value" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "curing_reminder_sent" (
	"plan_id" uuid NOT NULL,
	"pour_date" date NOT NULL,
	"day" date NOT NULL,
	"sent_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "curing_reminder_sent_plan_id_pour_date_day_pk" PRIMARY KEY("plan_id","pour_date","day")
);
--> statement-breakpoint
ALTER TABLE "plan" ADD COLUMN "curing_reminders" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "plan" ADD COLUMN "reminder_time_zone" text DEFAULT 'UTC' NOT NULL;--> statement-breakpoint
ALTER TABLE "curing_reminder_sent" ADD CONSTRAINT "curing_reminder_sent_plan_id_plan_id_fk" FOREIGN KEY ("plan_id") REFERENCES "public"."plan"("id") ON DELETE cascade ON UPDATE no action;