CREATE TYPE "public"."field_entry_kind" AS ENUM('shock-indicator', 'shock-log', 'temperatures', 'dew-point', 'observation');--> statement-breakpoint
CREATE TYPE "public"."levelling_run" AS ENUM('forward', 'backward');--> statement-breakpoint
ALTER TYPE "public"."attachment_subject_kind" ADD VALUE 'fieldEntry';--> statement-breakpoint
ALTER TYPE "public"."attachment_subject_kind" ADD VALUE 'levellingSection';--> statement-breakpoint
CREATE TABLE "field_entries" (
	"id" uuid PRIMARY KEY NOT NULL,
	"campaign_id" uuid NOT NULL,
	"site_id" uuid NOT NULL,
	"crate_id" uuid,
	"kind" "field_entry_kind" NOT NULL,
	"observed_at" timestamp with time zone NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"data" jsonb NOT NULL,
	"exceeded" boolean NOT NULL,
	"summary" text NOT NULL,
	"recorded_at" timestamp with time zone NOT NULL,
	"recorded_by" uuid,
	"change_seq" bigint NOT NULL
);
--> statement-breakpoint
CREATE TABLE "levelling_sections" (
	"id" uuid PRIMARY KEY NOT NULL,
	"campaign_id" uuid NOT NULL,
	"site_id" uuid NOT NULL,
	"from_mark" text NOT NULL,
	"to_mark" text NOT NULL,
	"class_id" text NOT NULL,
	"instrument" text DEFAULT '' NOT NULL,
	"opened_at" timestamp with time zone NOT NULL,
	"opened_by" uuid,
	"closed_at" timestamp with time zone,
	"closed_by" uuid,
	"close_note" text DEFAULT '' NOT NULL,
	"closure" jsonb,
	"change_seq" bigint NOT NULL
);
--> statement-breakpoint
CREATE TABLE "levelling_setups" (
	"id" uuid PRIMARY KEY NOT NULL,
	"campaign_id" uuid NOT NULL,
	"section_id" uuid NOT NULL,
	"run" "levelling_run" NOT NULL,
	"number" integer NOT NULL,
	"backsight_m" double precision NOT NULL,
	"foresight_m" double precision NOT NULL,
	"backsight_distance_m" double precision NOT NULL,
	"foresight_distance_m" double precision NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"recorded_at" timestamp with time zone NOT NULL,
	"recorded_by" uuid,
	"change_seq" bigint NOT NULL
);
--> statement-breakpoint
ALTER TABLE "field_entries" ADD CONSTRAINT "field_entries_campaign_id_campaigns_id_fk" FOREIGN KEY ("campaign_id") REFERENCES "public"."campaigns"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_entries" ADD CONSTRAINT "field_entries_site_id_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_entries" ADD CONSTRAINT "field_entries_crate_id_crates_id_fk" FOREIGN KEY ("crate_id") REFERENCES "public"."crates"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "field_entries" ADD CONSTRAINT "field_entries_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "levelling_sections" ADD CONSTRAINT "levelling_sections_campaign_id_campaigns_id_fk" FOREIGN KEY ("campaign_id") REFERENCES "public"."campaigns"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "levelling_sections" ADD CONSTRAINT "levelling_sections_site_id_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "levelling_sections" ADD CONSTRAINT "levelling_sections_opened_by_users_id_fk" FOREIGN KEY ("opened_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "levelling_sections" ADD CONSTRAINT "levelling_sections_closed_by_users_id_fk" FOREIGN KEY ("closed_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "levelling_setups" ADD CONSTRAINT "levelling_setups_campaign_id_campaigns_id_fk" FOREIGN KEY ("campaign_id") REFERENCES "public"."campaigns"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "levelling_setups" ADD CONSTRAINT "levelling_setups_section_id_levelling_sections_id_fk" FOREIGN KEY ("section_id") REFERENCES "public"."levelling_sections"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "levelling_setups" ADD CONSTRAINT "levelling_setups_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "field_entries_change_idx" ON "field_entries" USING btree ("campaign_id","change_seq");--> statement-breakpoint
CREATE INDEX "field_entries_site_idx" ON "field_entries" USING btree ("campaign_id","site_id");--> statement-breakpoint
CREATE INDEX "field_entries_crate_idx" ON "field_entries" USING btree ("crate_id");--> statement-breakpoint
CREATE INDEX "levelling_sections_change_idx" ON "levelling_sections" USING btree ("campaign_id","change_seq");--> statement-breakpoint
CREATE INDEX "levelling_sections_site_idx" ON "levelling_sections" USING btree ("campaign_id","site_id");--> statement-breakpoint
CREATE INDEX "levelling_setups_change_idx" ON "levelling_setups" USING btree ("campaign_id","change_seq");--> statement-breakpoint
CREATE INDEX "levelling_setups_section_idx" ON "levelling_setups" USING btree ("section_id");