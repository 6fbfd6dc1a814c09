CREATE TABLE "rate_limits" (
	"key" text PRIMARY KEY NOT NULL,
	"points" integer DEFAULT 0 NOT NULL,
	"expire" bigint
);
--> statement-breakpoint
DROP TABLE "verification_buckets" CASCADE;--> statement-breakpoint
DROP TABLE "sign_in_attempts" CASCADE;--> statement-breakpoint
CREATE INDEX "rate_limits_expire_idx" ON "rate_limits" USING btree ("expire");