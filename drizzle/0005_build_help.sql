CREATE TYPE "public"."log_visibility" AS ENUM('private', 'public');--> statement-breakpoint
CREATE TYPE "public"."reading_verdict" AS ENUM('within', 'low', 'high');--> statement-breakpoint
CREATE TYPE "public"."post_kind" AS ENUM('question', 'answer');--> statement-breakpoint
CREATE TYPE "public"."post_state" AS ENUM('pending', 'visible', 'hidden', 'removed');--> statement-breakpoint
CREATE TYPE "public"."checkpoint_verdict" AS ENUM('fine', 'needs_attention', 'stop');--> statement-breakpoint
CREATE TYPE "public"."dispute_outcome" AS ENUM('open', 'closed_payment_stands', 'refunded_full', 'refunded_partial');--> statement-breakpoint
CREATE TYPE "public"."review_state" AS ENUM('requested', 'accepted', 'delivered', 'closed', 'declined', 'expired', 'disputed');--> statement-breakpoint
CREATE TABLE "bring_up_logs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"owner_id" text NOT NULL,
	"kit_listing_id" uuid,
	"title" text NOT NULL,
	"notes_md" text DEFAULT '' NOT NULL,
	"visibility" "log_visibility" DEFAULT 'private' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "log_checkpoints" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"log_id" uuid NOT NULL,
	"source_checkpoint_id" uuid,
	"position" integer NOT NULL,
	"stage" "bring_up_stage" NOT NULL,
	"name" text NOT NULL,
	"measure" text NOT NULL,
	"unit" text NOT NULL,
	"expected_min" double precision NOT NULL,
	"expected_max" double precision NOT NULL,
	"added_by_builder" boolean DEFAULT false NOT NULL,
	CONSTRAINT "log_checkpoint_range" CHECK ("log_checkpoints"."expected_min" <= "log_checkpoints"."expected_max")
);
--> statement-breakpoint
CREATE TABLE "reading_photos" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"reading_id" uuid NOT NULL,
	"upload_key" text NOT NULL,
	"position" integer DEFAULT 0 NOT NULL,
	"caption" text DEFAULT '' NOT NULL
);
--> statement-breakpoint
CREATE TABLE "readings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"log_id" uuid NOT NULL,
	"checkpoint_id" uuid NOT NULL,
	"value" double precision NOT NULL,
	"entered_value" double precision NOT NULL,
	"entered_unit" text NOT NULL,
	"verdict" "reading_verdict" NOT NULL,
	"far_outside" boolean DEFAULT false NOT NULL,
	"instrument" text DEFAULT '' NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"taken_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "answer_votes" (
	"answer_id" uuid NOT NULL,
	"voter_id" text NOT NULL,
	"value" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "answer_votes_answer_id_voter_id_pk" PRIMARY KEY("answer_id","voter_id"),
	CONSTRAINT "vote_value" CHECK ("answer_votes"."value" in (-1, 1))
);
--> statement-breakpoint
CREATE TABLE "answers" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"question_id" uuid NOT NULL,
	"author_id" text NOT NULL,
	"body_md" text NOT NULL,
	"state" "post_state" DEFAULT 'pending' NOT NULL,
	"score" integer DEFAULT 0 NOT NULL,
	"removal_reason" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "post_flags" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"post_kind" "post_kind" NOT NULL,
	"post_id" uuid NOT NULL,
	"flagger_id" text NOT NULL,
	"reason" text NOT NULL,
	"resolved_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "post_photos" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"post_kind" "post_kind" NOT NULL,
	"post_id" uuid NOT NULL,
	"upload_key" text NOT NULL,
	"position" integer DEFAULT 0 NOT NULL
);
--> statement-breakpoint
CREATE TABLE "questions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"author_id" text NOT NULL,
	"listing_id" uuid,
	"log_id" uuid,
	"title" text NOT NULL,
	"body_md" text NOT NULL,
	"state" "post_state" DEFAULT 'pending' NOT NULL,
	"accepted_answer_id" uuid,
	"removal_reason" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "rate_limits" (
	"key" text NOT NULL,
	"window_start" timestamp with time zone NOT NULL,
	"count" integer DEFAULT 0 NOT NULL,
	CONSTRAINT "rate_limits_key_window_start_pk" PRIMARY KEY("key","window_start")
);
--> statement-breakpoint
CREATE TABLE "review_disputes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"session_id" uuid NOT NULL,
	"reason" text NOT NULL,
	"outcome" "dispute_outcome" DEFAULT 'open' NOT NULL,
	"refund_minor" integer,
	"decided_by" text,
	"decision_note" text,
	"decided_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "review_reports" (
	"session_id" uuid PRIMARY KEY NOT NULL,
	"summary_md" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "review_sessions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"log_id" uuid NOT NULL,
	"builder_id" text NOT NULL,
	"reviewer_id" text NOT NULL,
	"stages" jsonb NOT NULL,
	"state" "review_state" DEFAULT 'requested' NOT NULL,
	"price_minor" integer NOT NULL,
	"currency" text NOT NULL,
	"fee_bps" integer NOT NULL,
	"fee_minor" integer NOT NULL,
	"reviewer_share_minor" integer NOT NULL,
	"payment_intent_id" text,
	"captured_at" timestamp with time zone,
	"released_at" timestamp with time zone,
	"transfer_id" text,
	"refunded_minor" integer DEFAULT 0 NOT NULL,
	"message" text DEFAULT '' NOT NULL,
	"respond_by" timestamp with time zone NOT NULL,
	"accepted_at" timestamp with time zone,
	"delivered_at" timestamp with time zone,
	"dispute_by" timestamp with time zone,
	"closed_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "review_sessions_payment_intent_id_unique" UNIQUE("payment_intent_id"),
	CONSTRAINT "review_not_self" CHECK ("review_sessions"."builder_id" <> "review_sessions"."reviewer_id"),
	CONSTRAINT "review_split" CHECK ("review_sessions"."fee_minor" + "review_sessions"."reviewer_share_minor" = "review_sessions"."price_minor")
);
--> statement-breakpoint
CREATE TABLE "review_verdicts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"session_id" uuid NOT NULL,
	"checkpoint_id" uuid NOT NULL,
	"verdict" "checkpoint_verdict" NOT NULL,
	"comment" text DEFAULT '' NOT NULL
);
--> statement-breakpoint
CREATE TABLE "reviewer_applications" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" text NOT NULL,
	"expertise" jsonb NOT NULL,
	"profile_md" text NOT NULL,
	"track_record_md" text NOT NULL,
	"price_minor" integer NOT NULL,
	"currency" text DEFAULT 'EUR' NOT NULL,
	"status" "application_status" DEFAULT 'pending' NOT NULL,
	"decided_by" text,
	"decided_at" timestamp with time zone,
	"decision_reason" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "reviewer_profiles" (
	"user_id" text PRIMARY KEY NOT NULL,
	"expertise" jsonb NOT NULL,
	"profile_md" text NOT NULL,
	"price_minor" integer NOT NULL,
	"currency" text DEFAULT 'EUR' NOT NULL,
	"available" boolean DEFAULT true NOT NULL,
	"payout_account_id" text,
	"payouts_enabled" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "reviewer_profiles_payout_account_id_unique" UNIQUE("payout_account_id")
);
--> statement-breakpoint
ALTER TABLE "bring_up_logs" ADD CONSTRAINT "bring_up_logs_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bring_up_logs" ADD CONSTRAINT "bring_up_logs_kit_listing_id_listings_id_fk" FOREIGN KEY ("kit_listing_id") REFERENCES "public"."listings"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "log_checkpoints" ADD CONSTRAINT "log_checkpoints_log_id_bring_up_logs_id_fk" FOREIGN KEY ("log_id") REFERENCES "public"."bring_up_logs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "log_checkpoints" ADD CONSTRAINT "log_checkpoints_source_checkpoint_id_listing_checkpoints_id_fk" FOREIGN KEY ("source_checkpoint_id") REFERENCES "public"."listing_checkpoints"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reading_photos" ADD CONSTRAINT "reading_photos_reading_id_readings_id_fk" FOREIGN KEY ("reading_id") REFERENCES "public"."readings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reading_photos" ADD CONSTRAINT "reading_photos_upload_key_uploads_key_fk" FOREIGN KEY ("upload_key") REFERENCES "public"."uploads"("key") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "readings" ADD CONSTRAINT "readings_log_id_bring_up_logs_id_fk" FOREIGN KEY ("log_id") REFERENCES "public"."bring_up_logs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "readings" ADD CONSTRAINT "readings_checkpoint_id_log_checkpoints_id_fk" FOREIGN KEY ("checkpoint_id") REFERENCES "public"."log_checkpoints"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "answer_votes" ADD CONSTRAINT "answer_votes_answer_id_answers_id_fk" FOREIGN KEY ("answer_id") REFERENCES "public"."answers"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "answer_votes" ADD CONSTRAINT "answer_votes_voter_id_users_id_fk" FOREIGN KEY ("voter_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "answers" ADD CONSTRAINT "answers_question_id_questions_id_fk" FOREIGN KEY ("question_id") REFERENCES "public"."questions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "answers" ADD CONSTRAINT "answers_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "post_flags" ADD CONSTRAINT "post_flags_flagger_id_users_id_fk" FOREIGN KEY ("flagger_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "post_photos" ADD CONSTRAINT "post_photos_upload_key_uploads_key_fk" FOREIGN KEY ("upload_key") REFERENCES "public"."uploads"("key") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "questions" ADD CONSTRAINT "questions_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "questions" ADD CONSTRAINT "questions_listing_id_listings_id_fk" FOREIGN KEY ("listing_id") REFERENCES "public"."listings"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "questions" ADD CONSTRAINT "questions_log_id_bring_up_logs_id_fk" FOREIGN KEY ("log_id") REFERENCES "public"."bring_up_logs"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_disputes" ADD CONSTRAINT "review_disputes_session_id_review_sessions_id_fk" FOREIGN KEY ("session_id") REFERENCES "public"."review_sessions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_disputes" ADD CONSTRAINT "review_disputes_decided_by_users_id_fk" FOREIGN KEY ("decided_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_reports" ADD CONSTRAINT "review_reports_session_id_review_sessions_id_fk" FOREIGN KEY ("session_id") REFERENCES "public"."review_sessions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_sessions" ADD CONSTRAINT "review_sessions_log_id_bring_up_logs_id_fk" FOREIGN KEY ("log_id") REFERENCES "public"."bring_up_logs"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_sessions" ADD CONSTRAINT "review_sessions_builder_id_users_id_fk" FOREIGN KEY ("builder_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_sessions" ADD CONSTRAINT "review_sessions_reviewer_id_users_id_fk" FOREIGN KEY ("reviewer_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_verdicts" ADD CONSTRAINT "review_verdicts_session_id_review_sessions_id_fk" FOREIGN KEY ("session_id") REFERENCES "public"."review_sessions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_verdicts" ADD CONSTRAINT "review_verdicts_checkpoint_id_log_checkpoints_id_fk" FOREIGN KEY ("checkpoint_id") REFERENCES "public"."log_checkpoints"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reviewer_applications" ADD CONSTRAINT "reviewer_applications_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reviewer_applications" ADD CONSTRAINT "reviewer_applications_decided_by_users_id_fk" FOREIGN KEY ("decided_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reviewer_profiles" ADD CONSTRAINT "reviewer_profiles_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "bring_up_logs_owner_idx" ON "bring_up_logs" USING btree ("owner_id","updated_at");--> statement-breakpoint
CREATE INDEX "bring_up_logs_kit_idx" ON "bring_up_logs" USING btree ("kit_listing_id");--> statement-breakpoint
CREATE INDEX "log_checkpoints_log_idx" ON "log_checkpoints" USING btree ("log_id","position");--> statement-breakpoint
CREATE INDEX "reading_photos_reading_idx" ON "reading_photos" USING btree ("reading_id");--> statement-breakpoint
CREATE INDEX "reading_photos_upload_idx" ON "reading_photos" USING btree ("upload_key");--> statement-breakpoint
CREATE INDEX "readings_log_idx" ON "readings" USING btree ("log_id","taken_at");--> statement-breakpoint
CREATE INDEX "readings_checkpoint_idx" ON "readings" USING btree ("checkpoint_id");--> statement-breakpoint
CREATE INDEX "answers_question_idx" ON "answers" USING btree ("question_id","state");--> statement-breakpoint
CREATE INDEX "answers_author_idx" ON "answers" USING btree ("author_id");--> statement-breakpoint
CREATE UNIQUE INDEX "post_flags_once_idx" ON "post_flags" USING btree ("post_kind","post_id","flagger_id");--> statement-breakpoint
CREATE INDEX "post_flags_open_idx" ON "post_flags" USING btree ("resolved_at","created_at");--> statement-breakpoint
CREATE INDEX "post_photos_post_idx" ON "post_photos" USING btree ("post_kind","post_id");--> statement-breakpoint
CREATE INDEX "questions_state_idx" ON "questions" USING btree ("state","created_at");--> statement-breakpoint
CREATE INDEX "questions_listing_idx" ON "questions" USING btree ("listing_id");--> statement-breakpoint
CREATE INDEX "questions_author_idx" ON "questions" USING btree ("author_id");--> statement-breakpoint
CREATE INDEX "review_disputes_session_idx" ON "review_disputes" USING btree ("session_id");--> statement-breakpoint
CREATE INDEX "review_disputes_open_idx" ON "review_disputes" USING btree ("outcome","created_at");--> statement-breakpoint
CREATE INDEX "review_sessions_builder_idx" ON "review_sessions" USING btree ("builder_id","created_at");--> statement-breakpoint
CREATE INDEX "review_sessions_reviewer_idx" ON "review_sessions" USING btree ("reviewer_id","state");--> statement-breakpoint
CREATE INDEX "review_sessions_due_idx" ON "review_sessions" USING btree ("state","respond_by");--> statement-breakpoint
CREATE INDEX "review_verdicts_session_idx" ON "review_verdicts" USING btree ("session_id");--> statement-breakpoint
CREATE INDEX "reviewer_applications_status_idx" ON "reviewer_applications" USING btree ("status","created_at");--> statement-breakpoint
CREATE INDEX "reviewer_applications_user_idx" ON "reviewer_applications" USING btree ("user_id");