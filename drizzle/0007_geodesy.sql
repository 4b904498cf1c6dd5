CREATE TYPE "public"."analysis_state" AS ENUM('running', 'done', 'failed');--> statement-breakpoint
CREATE TYPE "public"."instrument_kind" AS ENUM('clock', 'link');--> statement-breakpoint
CREATE TYPE "public"."series_value_kind" AS ENUM('fractional', 'ratio');--> statement-breakpoint
CREATE TABLE "comparison_analyses" (
	"run_id" uuid PRIMARY KEY NOT NULL,
	"campaign_id" uuid NOT NULL,
	"data_revision" integer NOT NULL,
	"state" "analysis_state" NOT NULL,
	"error" text,
	"started_at" timestamp with time zone NOT NULL,
	"finished_at" timestamp with time zone,
	"result" jsonb
);
--> statement-breakpoint
CREATE TABLE "comparison_chunks" (
	"file_id" uuid NOT NULL,
	"chunk_no" integer NOT NULL,
	"times" double precision[] NOT NULL,
	"values" double precision[] NOT NULL,
	CONSTRAINT "comparison_chunks_file_id_chunk_no_pk" PRIMARY KEY("file_id","chunk_no")
);
--> statement-breakpoint
CREATE TABLE "comparison_files" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"campaign_id" uuid NOT NULL,
	"run_id" uuid NOT NULL,
	"file_name" text NOT NULL,
	"byte_size" bigint NOT NULL,
	"value_kind" "series_value_kind" NOT NULL,
	"nominal_ratio" text,
	"tau0_s" double precision NOT NULL,
	"row_count" integer NOT NULL,
	"valid_count" integer NOT NULL,
	"first_at" timestamp (6) with time zone NOT NULL,
	"last_at" timestamp (6) with time zone NOT NULL,
	"gaps" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"uploaded_by" uuid
);
--> statement-breakpoint
CREATE TABLE "comparison_runs" (
	"id" uuid PRIMARY KEY NOT NULL,
	"campaign_id" uuid NOT NULL,
	"name" text NOT NULL,
	"remote_site_id" uuid NOT NULL,
	"remote_clock_id" uuid NOT NULL,
	"reference_clock_id" uuid NOT NULL,
	"link_id" uuid,
	"link_name" text NOT NULL,
	"remote_mark" text DEFAULT '' NOT NULL,
	"reference_height_m" double precision,
	"reference_height_sigma_m" double precision,
	"target_height_uncertainty_m" double precision NOT NULL,
	"planned_uptime" double precision NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"data_revision" integer DEFAULT 0 NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"created_by" uuid,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "height_ties" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"campaign_id" uuid NOT NULL,
	"from_mark" text NOT NULL,
	"to_mark" text NOT NULL,
	"delta_m" double precision NOT NULL,
	"length_km" double precision NOT NULL,
	"sigma_m" double precision,
	"source" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"imported_by" uuid,
	"deleted_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "instruments" (
	"id" uuid PRIMARY KEY NOT NULL,
	"campaign_id" uuid NOT NULL,
	"kind" "instrument_kind" NOT NULL,
	"name" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"instability_at_1s" double precision NOT NULL,
	"systematic" jsonb NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_by" uuid,
	"deleted_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "levelling_adjustments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"campaign_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"computed_by" uuid,
	"options" jsonb NOT NULL,
	"result" jsonb NOT NULL
);
--> statement-breakpoint
ALTER TABLE "benchmarks" ADD COLUMN "datum" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "comparison_analyses" ADD CONSTRAINT "comparison_analyses_run_id_comparison_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."comparison_runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comparison_analyses" ADD CONSTRAINT "comparison_analyses_campaign_id_campaigns_id_fk" FOREIGN KEY ("campaign_id") REFERENCES "public"."campaigns"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comparison_chunks" ADD CONSTRAINT "comparison_chunks_file_id_comparison_files_id_fk" FOREIGN KEY ("file_id") REFERENCES "public"."comparison_files"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comparison_files" ADD CONSTRAINT "comparison_files_campaign_id_campaigns_id_fk" FOREIGN KEY ("campaign_id") REFERENCES "public"."campaigns"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comparison_files" ADD CONSTRAINT "comparison_files_run_id_comparison_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."comparison_runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comparison_files" ADD CONSTRAINT "comparison_files_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comparison_runs" ADD CONSTRAINT "comparison_runs_campaign_id_campaigns_id_fk" FOREIGN KEY ("campaign_id") REFERENCES "public"."campaigns"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comparison_runs" ADD CONSTRAINT "comparison_runs_remote_site_id_sites_id_fk" FOREIGN KEY ("remote_site_id") REFERENCES "public"."sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comparison_runs" ADD CONSTRAINT "comparison_runs_remote_clock_id_instruments_id_fk" FOREIGN KEY ("remote_clock_id") REFERENCES "public"."instruments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comparison_runs" ADD CONSTRAINT "comparison_runs_reference_clock_id_instruments_id_fk" FOREIGN KEY ("reference_clock_id") REFERENCES "public"."instruments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comparison_runs" ADD CONSTRAINT "comparison_runs_link_id_instruments_id_fk" FOREIGN KEY ("link_id") REFERENCES "public"."instruments"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comparison_runs" ADD CONSTRAINT "comparison_runs_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "comparison_runs" ADD CONSTRAINT "comparison_runs_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "height_ties" ADD CONSTRAINT "height_ties_campaign_id_campaigns_id_fk" FOREIGN KEY ("campaign_id") REFERENCES "public"."campaigns"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "height_ties" ADD CONSTRAINT "height_ties_imported_by_users_id_fk" FOREIGN KEY ("imported_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "instruments" ADD CONSTRAINT "instruments_campaign_id_campaigns_id_fk" FOREIGN KEY ("campaign_id") REFERENCES "public"."campaigns"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "instruments" ADD CONSTRAINT "instruments_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "levelling_adjustments" ADD CONSTRAINT "levelling_adjustments_campaign_id_campaigns_id_fk" FOREIGN KEY ("campaign_id") REFERENCES "public"."campaigns"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "levelling_adjustments" ADD CONSTRAINT "levelling_adjustments_computed_by_users_id_fk" FOREIGN KEY ("computed_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "comparison_files_run_idx" ON "comparison_files" USING btree ("run_id","first_at");--> statement-breakpoint
CREATE INDEX "comparison_runs_campaign_idx" ON "comparison_runs" USING btree ("campaign_id");--> statement-breakpoint
CREATE INDEX "comparison_runs_site_idx" ON "comparison_runs" USING btree ("remote_site_id");--> statement-breakpoint
CREATE INDEX "height_ties_campaign_idx" ON "height_ties" USING btree ("campaign_id");--> statement-breakpoint
CREATE INDEX "instruments_campaign_idx" ON "instruments" USING btree ("campaign_id");--> statement-breakpoint
CREATE INDEX "levelling_adjustments_campaign_idx" ON "levelling_adjustments" USING btree ("campaign_id","created_at");