CREATE TABLE "lab_drafts" (
	"user_id" uuid NOT NULL,
	"lab_slug" text NOT NULL,
	"choices" jsonb NOT NULL,
	"answers" jsonb NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "lab_drafts_user_id_lab_slug_pk" PRIMARY KEY("user_id","lab_slug")
);
--> statement-breakpoint
ALTER TABLE "lab_drafts" ADD CONSTRAINT "lab_drafts_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lab_drafts" ADD CONSTRAINT "lab_drafts_lab_slug_labs_slug_fk" FOREIGN KEY ("lab_slug") REFERENCES "public"."labs"("slug") ON DELETE cascade ON UPDATE no action;