CREATE TABLE "courses" (
	"slug" text PRIMARY KEY NOT NULL,
	"title" text NOT NULL,
	"unlock_in_order" boolean DEFAULT true NOT NULL,
	"synced_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "lab_attempts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" uuid NOT NULL,
	"lab_slug" text NOT NULL,
	"cohort_id" uuid,
	"idempotency_key" text NOT NULL,
	"attempt_number" integer NOT NULL,
	"variant_seed" text NOT NULL,
	"choices" jsonb NOT NULL,
	"outcome" jsonb NOT NULL,
	"score" integer NOT NULL,
	"passed" boolean NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "lab_attempts_user_idempotency_unique" UNIQUE("user_id","idempotency_key"),
	CONSTRAINT "lab_attempts_user_lab_number_unique" UNIQUE("user_id","lab_slug","attempt_number")
);
--> statement-breakpoint
CREATE TABLE "labs" (
	"slug" text PRIMARY KEY NOT NULL,
	"lesson_slug" text NOT NULL,
	"title" text NOT NULL
);
--> statement-breakpoint
CREATE TABLE "lesson_progress" (
	"user_id" uuid NOT NULL,
	"lesson_slug" text NOT NULL,
	"started_at" timestamp with time zone DEFAULT now() NOT NULL,
	"completed_at" timestamp with time zone,
	CONSTRAINT "lesson_progress_user_id_lesson_slug_pk" PRIMARY KEY("user_id","lesson_slug")
);
--> statement-breakpoint
CREATE TABLE "lessons" (
	"slug" text PRIMARY KEY NOT NULL,
	"course_slug" text NOT NULL,
	"number" integer NOT NULL,
	"title" text NOT NULL,
	CONSTRAINT "lessons_course_number_unique" UNIQUE("course_slug","number")
);
--> statement-breakpoint
CREATE TABLE "quick_check_answers" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" uuid NOT NULL,
	"lesson_slug" text NOT NULL,
	"check_id" text NOT NULL,
	"entry" text NOT NULL,
	"value" double precision,
	"correct" boolean NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "lab_attempts" ADD CONSTRAINT "lab_attempts_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lab_attempts" ADD CONSTRAINT "lab_attempts_lab_slug_labs_slug_fk" FOREIGN KEY ("lab_slug") REFERENCES "public"."labs"("slug") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lab_attempts" ADD CONSTRAINT "lab_attempts_cohort_id_cohorts_id_fk" FOREIGN KEY ("cohort_id") REFERENCES "public"."cohorts"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "labs" ADD CONSTRAINT "labs_lesson_slug_lessons_slug_fk" FOREIGN KEY ("lesson_slug") REFERENCES "public"."lessons"("slug") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lesson_progress" ADD CONSTRAINT "lesson_progress_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lesson_progress" ADD CONSTRAINT "lesson_progress_lesson_slug_lessons_slug_fk" FOREIGN KEY ("lesson_slug") REFERENCES "public"."lessons"("slug") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lessons" ADD CONSTRAINT "lessons_course_slug_courses_slug_fk" FOREIGN KEY ("course_slug") REFERENCES "public"."courses"("slug") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "quick_check_answers" ADD CONSTRAINT "quick_check_answers_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "quick_check_answers" ADD CONSTRAINT "quick_check_answers_lesson_slug_lessons_slug_fk" FOREIGN KEY ("lesson_slug") REFERENCES "public"."lessons"("slug") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "lab_attempts_lab_created_idx" ON "lab_attempts" USING btree ("lab_slug","created_at");--> statement-breakpoint
CREATE INDEX "quick_check_answers_user_lesson_idx" ON "quick_check_answers" USING btree ("user_id","lesson_slug");