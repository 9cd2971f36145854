CREATE TYPE "public"."compliance_status" AS ENUM('open', 'acknowledged', 'done', 'not_applicable');--> statement-breakpoint
CREATE TYPE "public"."notice_level" AS ENUM('mandatory', 'recommended', 'information');--> statement-breakpoint
CREATE TYPE "public"."notice_reach" AS ENUM('all', 'started', 'not_started');--> statement-breakpoint
CREATE TABLE "notice_builds" (
	"notice_id" uuid NOT NULL,
	"build_id" uuid NOT NULL,
	"traveler_ids" uuid[] DEFAULT '{}' NOT NULL,
	"status" "compliance_status" DEFAULT 'open' NOT NULL,
	"acknowledged_by" uuid,
	"acknowledged_at" timestamp with time zone,
	"answered_by" uuid,
	"answered_at" timestamp with time zone,
	"note" text,
	"reason" text,
	CONSTRAINT "notice_builds_notice_id_build_id_pk" PRIMARY KEY("notice_id","build_id")
);
--> statement-breakpoint
CREATE TABLE "notice_files" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"notice_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"position" integer NOT NULL,
	"name" text NOT NULL,
	"file_key" text NOT NULL,
	"thumb_key" text,
	"width" integer,
	"height" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "notice_mails" (
	"notice_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"recipient" text NOT NULL,
	"subject" text NOT NULL,
	"sent_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "notice_mails_notice_id_user_id_pk" PRIMARY KEY("notice_id","user_id")
);
--> statement-breakpoint
CREATE TABLE "notice_photos" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"notice_id" uuid NOT NULL,
	"build_id" uuid NOT NULL,
	"event_id" uuid NOT NULL,
	"file_key" text NOT NULL,
	"thumb_key" text NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"uploaded_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "notices" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" uuid NOT NULL,
	"kit_model_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"level" "notice_level" NOT NULL,
	"title" text NOT NULL,
	"body" text NOT NULL,
	"serial_from" text,
	"serial_to" text,
	"parts" jsonb NOT NULL,
	"reaches" "notice_reach" NOT NULL,
	"issued_by" uuid NOT NULL,
	"issued_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "notice_builds" ADD CONSTRAINT "notice_builds_notice_id_notices_id_fk" FOREIGN KEY ("notice_id") REFERENCES "public"."notices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notice_builds" ADD CONSTRAINT "notice_builds_build_id_builds_id_fk" FOREIGN KEY ("build_id") REFERENCES "public"."builds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notice_builds" ADD CONSTRAINT "notice_builds_acknowledged_by_users_id_fk" FOREIGN KEY ("acknowledged_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notice_builds" ADD CONSTRAINT "notice_builds_answered_by_users_id_fk" FOREIGN KEY ("answered_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notice_files" ADD CONSTRAINT "notice_files_notice_id_notices_id_fk" FOREIGN KEY ("notice_id") REFERENCES "public"."notices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notice_mails" ADD CONSTRAINT "notice_mails_notice_id_notices_id_fk" FOREIGN KEY ("notice_id") REFERENCES "public"."notices"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notice_mails" ADD CONSTRAINT "notice_mails_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notice_photos" ADD CONSTRAINT "notice_photos_event_id_build_events_id_fk" FOREIGN KEY ("event_id") REFERENCES "public"."build_events"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notice_photos" ADD CONSTRAINT "notice_photos_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notice_photos" ADD CONSTRAINT "notice_photos_notice_id_build_id_notice_builds_notice_id_build_id_fk" FOREIGN KEY ("notice_id","build_id") REFERENCES "public"."notice_builds"("notice_id","build_id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notices" ADD CONSTRAINT "notices_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notices" ADD CONSTRAINT "notices_kit_model_id_kit_models_id_fk" FOREIGN KEY ("kit_model_id") REFERENCES "public"."kit_models"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "notices" ADD CONSTRAINT "notices_issued_by_users_id_fk" FOREIGN KEY ("issued_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "notice_builds_build" ON "notice_builds" USING btree ("build_id");--> statement-breakpoint
CREATE INDEX "notice_files_notice" ON "notice_files" USING btree ("notice_id");--> statement-breakpoint
CREATE INDEX "notice_photos_answer" ON "notice_photos" USING btree ("notice_id","build_id");--> statement-breakpoint
CREATE UNIQUE INDEX "notices_org_number" ON "notices" USING btree ("organization_id","number");--> statement-breakpoint
CREATE INDEX "notices_kit_issued" ON "notices" USING btree ("kit_model_id","issued_at","id");