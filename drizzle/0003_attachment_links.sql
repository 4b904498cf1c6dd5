CREATE TYPE "public"."attachment_subject_kind" AS ENUM('site');--> statement-breakpoint
CREATE TABLE "attachment_links" (
	"id" uuid PRIMARY KEY NOT NULL,
	"campaign_id" uuid NOT NULL,
	"sha256" text NOT NULL,
	"content_type" text NOT NULL,
	"size_bytes" bigint NOT NULL,
	"name" text DEFAULT '' NOT NULL,
	"subject_kind" "attachment_subject_kind" NOT NULL,
	"subject_id" uuid NOT NULL,
	"caption" text DEFAULT '' NOT NULL,
	"taken_at" timestamp with time zone,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"removed_at" timestamp with time zone,
	"removed_by" uuid,
	"change_seq" bigint NOT NULL,
	CONSTRAINT "attachment_links_sha256_hex" CHECK ("attachment_links"."sha256" ~ '^[0-9a-f]{64}$')
);
--> statement-breakpoint
ALTER TABLE "attachment_links" ADD CONSTRAINT "attachment_links_campaign_id_campaigns_id_fk" FOREIGN KEY ("campaign_id") REFERENCES "public"."campaigns"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "attachment_links" ADD CONSTRAINT "attachment_links_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "attachment_links" ADD CONSTRAINT "attachment_links_removed_by_users_id_fk" FOREIGN KEY ("removed_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "attachment_links_change_idx" ON "attachment_links" USING btree ("campaign_id","change_seq");--> statement-breakpoint
CREATE INDEX "attachment_links_subject_idx" ON "attachment_links" USING btree ("campaign_id","subject_kind","subject_id");