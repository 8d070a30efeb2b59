ALTER TYPE "public"."token_purpose" ADD VALUE 'sign_in';--> statement-breakpoint
CREATE TABLE "throttle_counter" (
	"key" text PRIMARY KEY NOT NULL,
	"points" integer DEFAULT 0 NOT NULL,
	"expire" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "session" ADD COLUMN "created_at" timestamp with time zone DEFAULT now() NOT NULL;