CREATE TYPE "public"."capture_state" AS ENUM('queued', 'measuring', 'measured', 'failed');--> statement-breakpoint
CREATE TABLE "capture_blocks" (
	"capture_id" uuid NOT NULL,
	"series" smallint NOT NULL,
	"block" integer NOT NULL,
	"first_index" integer NOT NULL,
	"sample_count" integer NOT NULL,
	"first_time_s" double precision NOT NULL,
	"last_time_s" double precision NOT NULL,
	"data" "bytea" NOT NULL,
	CONSTRAINT "capture_blocks_capture_id_series_block_pk" PRIMARY KEY("capture_id","series","block")
);
--> statement-breakpoint
CREATE TABLE "capture_channels" (
	"capture_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"name" text NOT NULL,
	"unit" text,
	"min_value" double precision NOT NULL,
	"max_value" double precision NOT NULL,
	"figures" jsonb NOT NULL,
	CONSTRAINT "capture_channels_capture_id_position_pk" PRIMARY KEY("capture_id","position")
);
--> statement-breakpoint
CREATE TABLE "capture_pins" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"capture_id" uuid NOT NULL,
	"session_id" uuid NOT NULL,
	"author_id" text NOT NULL,
	"time_s" double precision NOT NULL,
	"channel" integer,
	"body" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "capture_pin_body_length" CHECK (char_length("capture_pins"."body") between 1 and 2000)
);
--> statement-breakpoint
CREATE TABLE "captures" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"log_id" uuid NOT NULL,
	"reading_id" uuid NOT NULL,
	"upload_key" text NOT NULL,
	"state" "capture_state" DEFAULT 'queued' NOT NULL,
	"progress" integer DEFAULT 0 NOT NULL,
	"error_message" text,
	"sample_count" integer,
	"start_time_s" double precision,
	"end_time_s" double precision,
	"sample_interval_s" double precision,
	"evenly_spaced" boolean,
	"measured_at" timestamp with time zone,
	"applied_at" timestamp with time zone,
	"applied_channel" integer,
	"applied_figure" text,
	"applied_value" double precision,
	"value_before" double precision,
	"entered_value_before" double precision,
	"entered_unit_before" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "captures_upload_key_unique" UNIQUE("upload_key"),
	CONSTRAINT "capture_progress_range" CHECK ("captures"."progress" between 0 and 100)
);
--> statement-breakpoint
ALTER TABLE "capture_blocks" ADD CONSTRAINT "capture_blocks_capture_id_captures_id_fk" FOREIGN KEY ("capture_id") REFERENCES "public"."captures"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "capture_channels" ADD CONSTRAINT "capture_channels_capture_id_captures_id_fk" FOREIGN KEY ("capture_id") REFERENCES "public"."captures"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "capture_pins" ADD CONSTRAINT "capture_pins_capture_id_captures_id_fk" FOREIGN KEY ("capture_id") REFERENCES "public"."captures"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "capture_pins" ADD CONSTRAINT "capture_pins_session_id_review_sessions_id_fk" FOREIGN KEY ("session_id") REFERENCES "public"."review_sessions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "capture_pins" ADD CONSTRAINT "capture_pins_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "captures" ADD CONSTRAINT "captures_log_id_bring_up_logs_id_fk" FOREIGN KEY ("log_id") REFERENCES "public"."bring_up_logs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "captures" ADD CONSTRAINT "captures_reading_id_readings_id_fk" FOREIGN KEY ("reading_id") REFERENCES "public"."readings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "captures" ADD CONSTRAINT "captures_upload_key_uploads_key_fk" FOREIGN KEY ("upload_key") REFERENCES "public"."uploads"("key") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "capture_pins_capture_idx" ON "capture_pins" USING btree ("capture_id","time_s");--> statement-breakpoint
CREATE INDEX "capture_pins_session_idx" ON "capture_pins" USING btree ("session_id");--> statement-breakpoint
CREATE INDEX "captures_reading_idx" ON "captures" USING btree ("reading_id");--> statement-breakpoint
CREATE INDEX "captures_log_idx" ON "captures" USING btree ("log_id","created_at");--> statement-breakpoint
CREATE INDEX "captures_state_idx" ON "captures" USING btree ("state","updated_at");