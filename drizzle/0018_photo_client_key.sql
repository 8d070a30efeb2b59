ALTER TABLE "plan_photo" ADD COLUMN "client_key" text;--> statement-breakpoint
CREATE UNIQUE INDEX "plan_photo_client_key_idx" ON "plan_photo" USING btree ("plan_id","client_key");