ALTER TABLE "users" DROP CONSTRAINT "users_email_unique";--> statement-breakpoint
CREATE UNIQUE INDEX "users_sign_in_email_unique" ON "users" USING btree ("email") WHERE "users"."password_hash" <> '!unset';--> statement-breakpoint
CREATE UNIQUE INDEX "users_school_email_unique" ON "users" USING btree ("school_id","email");