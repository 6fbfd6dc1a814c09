ALTER TABLE "certificates" ADD COLUMN "certification" jsonb;--> statement-breakpoint
ALTER TABLE "certificates" ADD COLUMN "signatory_name" text;--> statement-breakpoint
ALTER TABLE "certificates" ADD COLUMN "signatory_role" text;--> statement-breakpoint
ALTER TABLE "schools" ADD COLUMN "signatory_name" text;--> statement-breakpoint
ALTER TABLE "schools" ADD COLUMN "signatory_role" text;--> statement-breakpoint
ALTER TABLE "certificates" ADD CONSTRAINT "certificates_signatory_complete" CHECK (("certificates"."signatory_name" is null) = ("certificates"."signatory_role" is null));--> statement-breakpoint
ALTER TABLE "schools" ADD CONSTRAINT "schools_signatory_complete" CHECK (("schools"."signatory_name" is null) = ("schools"."signatory_role" is null));