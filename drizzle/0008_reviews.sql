CREATE TYPE "public"."review_decision" AS ENUM('approved', 'sentBack', 'reopened');--> statement-breakpoint
CREATE TYPE "public"."review_subject_kind" AS ENUM('checklistRun', 'fieldEntry', 'levellingSection', 'leg', 'handover');--> statement-breakpoint
CREATE TABLE "entry_reviews" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"campaign_id" uuid NOT NULL,
	"subject_kind" "review_subject_kind" NOT NULL,
	"subject_id" uuid NOT NULL,
	"decision" "review_decision" NOT NULL,
	"comment" text DEFAULT '' NOT NULL,
	"reviewed_seq" bigint NOT NULL,
	"decided_by" uuid,
	"decided_at" timestamp with time zone DEFAULT now() NOT NULL,
	"change_seq" bigint NOT NULL
);
--> statement-breakpoint
CREATE TABLE "review_summary_subscriptions" (
	"campaign_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_week" text,
	CONSTRAINT "review_summary_subscriptions_campaign_id_user_id_pk" PRIMARY KEY("campaign_id","user_id")
);
--> statement-breakpoint
ALTER TABLE "entry_reviews" ADD CONSTRAINT "entry_reviews_campaign_id_campaigns_id_fk" FOREIGN KEY ("campaign_id") REFERENCES "public"."campaigns"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "entry_reviews" ADD CONSTRAINT "entry_reviews_decided_by_users_id_fk" FOREIGN KEY ("decided_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_summary_subscriptions" ADD CONSTRAINT "review_summary_subscriptions_campaign_id_campaigns_id_fk" FOREIGN KEY ("campaign_id") REFERENCES "public"."campaigns"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_summary_subscriptions" ADD CONSTRAINT "review_summary_subscriptions_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "entry_reviews_change_idx" ON "entry_reviews" USING btree ("campaign_id","change_seq");--> statement-breakpoint
CREATE INDEX "entry_reviews_subject_idx" ON "entry_reviews" USING btree ("campaign_id","subject_kind","subject_id","change_seq");