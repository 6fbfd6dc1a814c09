CREATE TYPE "public"."bench_review_decision" AS ENUM('accept', 'return');--> statement-breakpoint
CREATE TYPE "public"."bench_submission_status" AS ENUM('draft', 'submitted', 'accepted', 'returned');--> statement-breakpoint
CREATE TABLE "bench_photos" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"submission_id" uuid NOT NULL,
	"file_key" text NOT NULL,
	"name" text NOT NULL,
	"size" integer NOT NULL,
	"content_type" text NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "bench_photos_file_key_unique" UNIQUE("file_key")
);
--> statement-breakpoint
CREATE TABLE "bench_reviews" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"submission_id" uuid NOT NULL,
	"reviewer_id" uuid NOT NULL,
	"scores" jsonb NOT NULL,
	"total" integer NOT NULL,
	"max_total" integer NOT NULL,
	"feedback" text NOT NULL,
	"decision" "bench_review_decision" NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "bench_submissions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"learner_id" uuid NOT NULL,
	"cohort_id" uuid NOT NULL,
	"exercise_slug" text NOT NULL,
	"status" "bench_submission_status" DEFAULT 'draft' NOT NULL,
	"cable_kind" text,
	"length_m" double precision,
	"series_resistance_ohm" double precision,
	"driver_voltage_v" double precision,
	"rise_time_s" double precision,
	"overshoot_v" double precision,
	"text_answers" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"submitted_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "bench_submissions_learner_exercise_unique" UNIQUE("learner_id","exercise_slug")
);
--> statement-breakpoint
ALTER TABLE "bench_photos" ADD CONSTRAINT "bench_photos_submission_id_bench_submissions_id_fk" FOREIGN KEY ("submission_id") REFERENCES "public"."bench_submissions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_reviews" ADD CONSTRAINT "bench_reviews_submission_id_bench_submissions_id_fk" FOREIGN KEY ("submission_id") REFERENCES "public"."bench_submissions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_reviews" ADD CONSTRAINT "bench_reviews_reviewer_id_users_id_fk" FOREIGN KEY ("reviewer_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_submissions" ADD CONSTRAINT "bench_submissions_learner_id_users_id_fk" FOREIGN KEY ("learner_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_submissions" ADD CONSTRAINT "bench_submissions_cohort_id_cohorts_id_fk" FOREIGN KEY ("cohort_id") REFERENCES "public"."cohorts"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "bench_photos_submission_created_idx" ON "bench_photos" USING btree ("submission_id","created_at");--> statement-breakpoint
CREATE INDEX "bench_reviews_submission_created_idx" ON "bench_reviews" USING btree ("submission_id","created_at");--> statement-breakpoint
CREATE INDEX "bench_submissions_status_submitted_idx" ON "bench_submissions" USING btree ("status","submitted_at");--> statement-breakpoint
CREATE INDEX "bench_submissions_cohort_status_submitted_idx" ON "bench_submissions" USING btree ("cohort_id","status","submitted_at");