CREATE TYPE "public"."crate_state" AS ENUM('ready', 'moving', 'arrived', 'unpacked', 'returned', 'held');--> statement-breakpoint
CREATE TYPE "public"."handover_condition" AS ENUM('intact', 'marked', 'damaged');--> statement-breakpoint
ALTER TYPE "public"."attachment_subject_kind" ADD VALUE 'handover';--> statement-breakpoint
CREATE TABLE "alerts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"campaign_id" uuid NOT NULL,
	"crate_id" uuid,
	"site_id" uuid,
	"entry_id" uuid,
	"kind" text NOT NULL,
	"summary" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"acknowledged_at" timestamp with time zone,
	"acknowledged_by" uuid,
	"acknowledge_note" text DEFAULT '' NOT NULL,
	"change_seq" bigint NOT NULL
);
--> statement-breakpoint
CREATE TABLE "handovers" (
	"id" uuid PRIMARY KEY NOT NULL,
	"campaign_id" uuid NOT NULL,
	"crate_id" uuid NOT NULL,
	"leg_id" uuid,
	"from_name" text NOT NULL,
	"to_name" text NOT NULL,
	"at" timestamp with time zone NOT NULL,
	"site_id" uuid,
	"place" text DEFAULT '' NOT NULL,
	"condition" "handover_condition" NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"recorded_by" uuid,
	"recorded_at" timestamp with time zone NOT NULL,
	"change_seq" bigint NOT NULL
);
--> statement-breakpoint
CREATE TABLE "legs" (
	"id" uuid PRIMARY KEY NOT NULL,
	"campaign_id" uuid NOT NULL,
	"crate_id" uuid NOT NULL,
	"from_site_id" uuid NOT NULL,
	"to_site_id" uuid NOT NULL,
	"vehicle" text DEFAULT '' NOT NULL,
	"planned_depart_at" timestamp with time zone NOT NULL,
	"planned_arrive_at" timestamp with time zone NOT NULL,
	"departed_at" timestamp with time zone,
	"departed_by" uuid,
	"arrived_at" timestamp with time zone,
	"arrived_by" uuid,
	"cancelled_at" timestamp with time zone,
	"cancelled_by" uuid,
	"note" text DEFAULT '' NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"change_seq" bigint NOT NULL
);
--> statement-breakpoint
ALTER TABLE "crates" ADD COLUMN "instrument" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "crates" ADD COLUMN "max_tilt_deg" double precision;--> statement-breakpoint
ALTER TABLE "crates" ADD COLUMN "state" "crate_state" DEFAULT 'ready' NOT NULL;--> statement-breakpoint
ALTER TABLE "email_outbox" ADD COLUMN "message_key" text;--> statement-breakpoint
ALTER TABLE "alerts" ADD CONSTRAINT "alerts_campaign_id_campaigns_id_fk" FOREIGN KEY ("campaign_id") REFERENCES "public"."campaigns"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "alerts" ADD CONSTRAINT "alerts_crate_id_crates_id_fk" FOREIGN KEY ("crate_id") REFERENCES "public"."crates"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "alerts" ADD CONSTRAINT "alerts_site_id_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "alerts" ADD CONSTRAINT "alerts_entry_id_field_entries_id_fk" FOREIGN KEY ("entry_id") REFERENCES "public"."field_entries"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "alerts" ADD CONSTRAINT "alerts_acknowledged_by_users_id_fk" FOREIGN KEY ("acknowledged_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "handovers" ADD CONSTRAINT "handovers_campaign_id_campaigns_id_fk" FOREIGN KEY ("campaign_id") REFERENCES "public"."campaigns"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "handovers" ADD CONSTRAINT "handovers_crate_id_crates_id_fk" FOREIGN KEY ("crate_id") REFERENCES "public"."crates"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "handovers" ADD CONSTRAINT "handovers_leg_id_legs_id_fk" FOREIGN KEY ("leg_id") REFERENCES "public"."legs"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "handovers" ADD CONSTRAINT "handovers_site_id_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "handovers" ADD CONSTRAINT "handovers_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "legs" ADD CONSTRAINT "legs_campaign_id_campaigns_id_fk" FOREIGN KEY ("campaign_id") REFERENCES "public"."campaigns"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "legs" ADD CONSTRAINT "legs_crate_id_crates_id_fk" FOREIGN KEY ("crate_id") REFERENCES "public"."crates"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "legs" ADD CONSTRAINT "legs_from_site_id_sites_id_fk" FOREIGN KEY ("from_site_id") REFERENCES "public"."sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "legs" ADD CONSTRAINT "legs_to_site_id_sites_id_fk" FOREIGN KEY ("to_site_id") REFERENCES "public"."sites"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "legs" ADD CONSTRAINT "legs_departed_by_users_id_fk" FOREIGN KEY ("departed_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "legs" ADD CONSTRAINT "legs_arrived_by_users_id_fk" FOREIGN KEY ("arrived_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "legs" ADD CONSTRAINT "legs_cancelled_by_users_id_fk" FOREIGN KEY ("cancelled_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "legs" ADD CONSTRAINT "legs_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "alerts_change_idx" ON "alerts" USING btree ("campaign_id","change_seq");--> statement-breakpoint
CREATE UNIQUE INDEX "alerts_entry_key" ON "alerts" USING btree ("entry_id");--> statement-breakpoint
CREATE INDEX "handovers_change_idx" ON "handovers" USING btree ("campaign_id","change_seq");--> statement-breakpoint
CREATE INDEX "handovers_crate_idx" ON "handovers" USING btree ("crate_id","at");--> statement-breakpoint
CREATE INDEX "legs_change_idx" ON "legs" USING btree ("campaign_id","change_seq");--> statement-breakpoint
CREATE INDEX "legs_crate_idx" ON "legs" USING btree ("crate_id");--> statement-breakpoint
CREATE UNIQUE INDEX "email_outbox_message_key" ON "email_outbox" USING btree ("message_key");