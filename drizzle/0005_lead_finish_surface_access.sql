ALTER TABLE "lead" ADD COLUMN "finish" text DEFAULT 'broom' NOT NULL;--> statement-breakpoint
ALTER TABLE "lead" ADD COLUMN "existing_surface" text DEFAULT 'grass_soil' NOT NULL;--> statement-breakpoint
ALTER TABLE "lead" ADD COLUMN "site_access" text DEFAULT '' NOT NULL;