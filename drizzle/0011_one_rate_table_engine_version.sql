-- One counter table for every rate limiter (throttle_counter, by key prefix); each plan result
-- records the engine version that computed it (0: saved before versions were recorded).
DROP TABLE "api_rate_counter" CASCADE;--> statement-breakpoint
ALTER TABLE "plan" ADD COLUMN "engine_version" integer DEFAULT 0 NOT NULL;