ALTER TABLE "invitations" ADD COLUMN "mail_pending_since" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "invitations" ADD COLUMN "mail_attempts" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "invitations" ADD COLUMN "mail_next_try_at" timestamp with time zone;--> statement-breakpoint
CREATE INDEX "invitations_mail_waiting_idx" ON "invitations" USING btree ("mail_next_try_at") WHERE "invitations"."mail_pending_since" is not null;