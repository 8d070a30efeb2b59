CREATE INDEX "user_disabled_idx" ON "user" USING btree ("id") WHERE "user"."disabled_at" is not null;--> statement-breakpoint
CREATE INDEX "contractor_approved_lat_idx" ON "contractor" USING btree ("service_lat") WHERE "contractor"."status" = 'approved';--> statement-breakpoint
CREATE INDEX "lead_homeowner_idx" ON "lead" USING btree ("homeowner_id");