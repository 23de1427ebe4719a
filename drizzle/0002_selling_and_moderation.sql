CREATE TYPE "public"."upload_purpose" AS ENUM('listing-photo', 'listing-document', 'reading-photo', 'capture');--> statement-breakpoint
CREATE TYPE "public"."application_status" AS ENUM('pending', 'approved', 'declined');--> statement-breakpoint
CREATE TYPE "public"."bring_up_stage" AS ENUM('control-supply', 'series-lamp', 'low-current', 'rated-load');--> statement-breakpoint
CREATE TYPE "public"."document_kind" AS ENUM('schematic', 'bom', 'build-notes', 'other');--> statement-breakpoint
CREATE TYPE "public"."listing_kind" AS ENUM('board', 'magnetic', 'kit');--> statement-breakpoint
CREATE TYPE "public"."listing_state" AS ENUM('draft', 'in_review', 'live', 'sent_back', 'held', 'retired');--> statement-breakpoint
CREATE TYPE "public"."magnetic_subtype" AS ENUM('transformer', 'choke', 'current-transformer');--> statement-breakpoint
CREATE TYPE "public"."listing_decision" AS ENUM('submitted', 'approved', 'sent_back', 'held', 'restored', 'retired', 'grace_notice', 'grace_expired');--> statement-breakpoint
CREATE TYPE "public"."mail_status" AS ENUM('pending', 'sent', 'failed');--> statement-breakpoint
CREATE TABLE "uploads" (
	"key" text PRIMARY KEY NOT NULL,
	"owner_id" text NOT NULL,
	"purpose" "upload_purpose" NOT NULL,
	"original_name" text NOT NULL,
	"content_type" text NOT NULL,
	"bytes" integer NOT NULL,
	"url" text NOT NULL,
	"thumb_key" text,
	"thumb_url" text,
	"width" integer,
	"height" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "seller_applications" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"user_id" text NOT NULL,
	"shop_name" text NOT NULL,
	"profile_md" text NOT NULL,
	"country" text NOT NULL,
	"returns_policy_md" text NOT NULL,
	"returns_window_days" integer DEFAULT 30 NOT NULL,
	"status" "application_status" DEFAULT 'pending' NOT NULL,
	"decided_by" text,
	"decided_at" timestamp with time zone,
	"decision_reason" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "seller_profiles" (
	"user_id" text PRIMARY KEY NOT NULL,
	"shop_name" text NOT NULL,
	"slug" text NOT NULL,
	"profile_md" text NOT NULL,
	"country" text NOT NULL,
	"returns_policy_md" text NOT NULL,
	"returns_window_days" integer DEFAULT 30 NOT NULL,
	"payout_account_id" text,
	"payouts_enabled" boolean DEFAULT false NOT NULL,
	"charges_enabled" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "seller_profiles_shop_name_unique" UNIQUE("shop_name"),
	CONSTRAINT "seller_profiles_slug_unique" UNIQUE("slug"),
	CONSTRAINT "seller_profiles_payout_account_id_unique" UNIQUE("payout_account_id")
);
--> statement-breakpoint
CREATE TABLE "listing_checkpoints" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"listing_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"stage" "bring_up_stage" NOT NULL,
	"name" text NOT NULL,
	"measure" text NOT NULL,
	"unit" text NOT NULL,
	"expected_min" double precision NOT NULL,
	"expected_max" double precision NOT NULL,
	CONSTRAINT "checkpoint_range" CHECK ("listing_checkpoints"."expected_min" <= "listing_checkpoints"."expected_max")
);
--> statement-breakpoint
CREATE TABLE "listing_documents" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"listing_id" uuid NOT NULL,
	"upload_key" text NOT NULL,
	"kind" "document_kind" NOT NULL,
	"title" text NOT NULL,
	"position" integer DEFAULT 0 NOT NULL
);
--> statement-breakpoint
CREATE TABLE "listing_photos" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"listing_id" uuid NOT NULL,
	"upload_key" text NOT NULL,
	"position" integer NOT NULL,
	"alt" text DEFAULT '' NOT NULL
);
--> statement-breakpoint
CREATE TABLE "listing_requirements" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"listing_id" uuid NOT NULL,
	"subtype" "magnetic_subtype" NOT NULL,
	"label" text NOT NULL,
	"min_inductance_h" double precision,
	"at_current_a" double precision
);
--> statement-breakpoint
CREATE TABLE "listing_versions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"listing_id" uuid NOT NULL,
	"snapshot" jsonb NOT NULL,
	"approved_by" text,
	"approved_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "listings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"seller_id" text NOT NULL,
	"kind" "listing_kind" NOT NULL,
	"magnetic_subtype" "magnetic_subtype",
	"title" text NOT NULL,
	"slug" text NOT NULL,
	"description_md" text DEFAULT '' NOT NULL,
	"price_minor" integer NOT NULL,
	"currency" text DEFAULT 'EUR' NOT NULL,
	"stock" integer DEFAULT 0 NOT NULL,
	"shipping_weight_g" integer DEFAULT 0 NOT NULL,
	"figures" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"declaration" jsonb NOT NULL,
	"safety_notes" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"sheet_revision" integer DEFAULT 1 NOT NULL,
	"state" "listing_state" DEFAULT 'draft' NOT NULL,
	"policy_revision" integer,
	"policy_status" text,
	"inductance_h" double precision,
	"rated_current_a" double precision,
	"mains_connected" boolean GENERATED ALWAYS AS (((declaration->>'mainsConnected')::boolean)) STORED,
	"moderator_message" text,
	"grace_until" timestamp with time zone,
	"submitted_at" timestamp with time zone,
	"live_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "listings_stock_non_negative" CHECK ("listings"."stock" >= 0),
	CONSTRAINT "listings_price_non_negative" CHECK ("listings"."price_minor" >= 0),
	CONSTRAINT "listings_subtype_only_for_magnetics" CHECK (("listings"."kind" = 'magnetic') = ("listings"."magnetic_subtype" is not null))
);
--> statement-breakpoint
CREATE TABLE "listing_decisions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"listing_id" uuid NOT NULL,
	"actor_id" text,
	"decision" "listing_decision" NOT NULL,
	"reasons" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"note" text,
	"policy_revision" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "policy_recheck_results" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"revision" integer NOT NULL,
	"listing_id" uuid NOT NULL,
	"status" text NOT NULL,
	"findings" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"grace_until" timestamp with time zone,
	"notice_sent_at" timestamp with time zone,
	"held_at" timestamp with time zone,
	"resolved_at" timestamp with time zone,
	"checked_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "policy_revisions" (
	"revision" integer PRIMARY KEY NOT NULL,
	"rules" jsonb NOT NULL,
	"summary" text NOT NULL,
	"grace_days" integer DEFAULT 14 NOT NULL,
	"published_by" text,
	"published_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "mail_outbox" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"template" text NOT NULL,
	"to" text NOT NULL,
	"props" jsonb NOT NULL,
	"status" "mail_status" DEFAULT 'pending' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"last_error" text,
	"provider_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"sent_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "uploads" ADD CONSTRAINT "uploads_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "seller_applications" ADD CONSTRAINT "seller_applications_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "seller_applications" ADD CONSTRAINT "seller_applications_decided_by_users_id_fk" FOREIGN KEY ("decided_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "seller_profiles" ADD CONSTRAINT "seller_profiles_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "listing_checkpoints" ADD CONSTRAINT "listing_checkpoints_listing_id_listings_id_fk" FOREIGN KEY ("listing_id") REFERENCES "public"."listings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "listing_documents" ADD CONSTRAINT "listing_documents_listing_id_listings_id_fk" FOREIGN KEY ("listing_id") REFERENCES "public"."listings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "listing_documents" ADD CONSTRAINT "listing_documents_upload_key_uploads_key_fk" FOREIGN KEY ("upload_key") REFERENCES "public"."uploads"("key") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "listing_photos" ADD CONSTRAINT "listing_photos_listing_id_listings_id_fk" FOREIGN KEY ("listing_id") REFERENCES "public"."listings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "listing_photos" ADD CONSTRAINT "listing_photos_upload_key_uploads_key_fk" FOREIGN KEY ("upload_key") REFERENCES "public"."uploads"("key") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "listing_requirements" ADD CONSTRAINT "listing_requirements_listing_id_listings_id_fk" FOREIGN KEY ("listing_id") REFERENCES "public"."listings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "listing_versions" ADD CONSTRAINT "listing_versions_listing_id_listings_id_fk" FOREIGN KEY ("listing_id") REFERENCES "public"."listings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "listing_versions" ADD CONSTRAINT "listing_versions_approved_by_users_id_fk" FOREIGN KEY ("approved_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "listings" ADD CONSTRAINT "listings_seller_id_users_id_fk" FOREIGN KEY ("seller_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "listing_decisions" ADD CONSTRAINT "listing_decisions_listing_id_listings_id_fk" FOREIGN KEY ("listing_id") REFERENCES "public"."listings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "listing_decisions" ADD CONSTRAINT "listing_decisions_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "policy_recheck_results" ADD CONSTRAINT "policy_recheck_results_revision_policy_revisions_revision_fk" FOREIGN KEY ("revision") REFERENCES "public"."policy_revisions"("revision") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "policy_recheck_results" ADD CONSTRAINT "policy_recheck_results_listing_id_listings_id_fk" FOREIGN KEY ("listing_id") REFERENCES "public"."listings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "policy_revisions" ADD CONSTRAINT "policy_revisions_published_by_users_id_fk" FOREIGN KEY ("published_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "uploads_owner_idx" ON "uploads" USING btree ("owner_id","created_at");--> statement-breakpoint
CREATE INDEX "seller_applications_user_idx" ON "seller_applications" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "seller_applications_status_idx" ON "seller_applications" USING btree ("status","created_at");--> statement-breakpoint
CREATE INDEX "listing_checkpoints_listing_idx" ON "listing_checkpoints" USING btree ("listing_id","position");--> statement-breakpoint
CREATE INDEX "listing_documents_listing_idx" ON "listing_documents" USING btree ("listing_id");--> statement-breakpoint
CREATE INDEX "listing_documents_upload_idx" ON "listing_documents" USING btree ("upload_key");--> statement-breakpoint
CREATE UNIQUE INDEX "listing_photos_position_idx" ON "listing_photos" USING btree ("listing_id","position");--> statement-breakpoint
CREATE INDEX "listing_photos_upload_idx" ON "listing_photos" USING btree ("upload_key");--> statement-breakpoint
CREATE INDEX "listing_requirements_listing_idx" ON "listing_requirements" USING btree ("listing_id");--> statement-breakpoint
CREATE INDEX "listing_requirements_match_idx" ON "listing_requirements" USING btree ("subtype");--> statement-breakpoint
CREATE INDEX "listing_versions_listing_idx" ON "listing_versions" USING btree ("listing_id","approved_at");--> statement-breakpoint
CREATE INDEX "listings_seller_idx" ON "listings" USING btree ("seller_id");--> statement-breakpoint
CREATE INDEX "listings_state_idx" ON "listings" USING btree ("state","submitted_at");--> statement-breakpoint
CREATE INDEX "listings_catalog_idx" ON "listings" USING btree ("state","kind","price_minor");--> statement-breakpoint
CREATE UNIQUE INDEX "listings_slug_idx" ON "listings" USING btree ("slug");--> statement-breakpoint
CREATE INDEX "listing_decisions_listing_idx" ON "listing_decisions" USING btree ("listing_id","created_at");--> statement-breakpoint
CREATE INDEX "policy_recheck_results_revision_idx" ON "policy_recheck_results" USING btree ("revision","status");--> statement-breakpoint
CREATE INDEX "policy_recheck_results_listing_idx" ON "policy_recheck_results" USING btree ("listing_id");--> statement-breakpoint
CREATE INDEX "mail_outbox_pending_idx" ON "mail_outbox" USING btree ("status","created_at");