-- One counter table for every rate limiter (throttle_counter, by key prefix); each plan result
-- records the engine version that computed it (0: saved before versions were recorded).
-- The counters are UNLOGGED, as the estimate API's were (0011): written on nearly every request and
-- worth little after a crash (a crash only restarts each key's window), so no request waits for a
-- write-ahead-log flush. Every app server still shares the one table.
DROP TABLE "api_rate_counter" CASCADE;--> statement-breakpoint
ALTER TABLE "plan" ADD COLUMN "engine_version" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "throttle_counter" SET UNLOGGED;
