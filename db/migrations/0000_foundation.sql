CREATE TYPE "public"."organization_kind" AS ENUM('supplier', 'shop');--> statement-breakpoint
CREATE TYPE "public"."user_role" AS ENUM('supplier', 'builder', 'inspector', 'admin');--> statement-breakpoint
CREATE TYPE "public"."aircraft_category" AS ENUM('normal', 'utility', 'acrobatic');--> statement-breakpoint
CREATE TYPE "public"."part_kind" AS ENUM('rib', 'nose_rib', 'skin_panel', 'spar_web');--> statement-breakpoint
CREATE TYPE "public"."revision_status" AS ENUM('draft', 'published', 'superseded');--> statement-breakpoint
CREATE TYPE "public"."build_member_role" AS ENUM('builder', 'inspector');--> statement-breakpoint
CREATE TYPE "public"."hole_status" AS ENUM('pending', 'installed', 'flagged', 'held', 'reworked', 'accepted');--> statement-breakpoint
CREATE TYPE "public"."disposition" AS ENUM('use_as_is', 'rework', 'repair', 'scrap');--> statement-breakpoint
CREATE TYPE "public"."finding_kind" AS ENUM('elongated', 'oversize', 'cracked', 'edge_distance_short', 'deformed_flange', 'poor_shop_head', 'other');--> statement-breakpoint
CREATE TYPE "public"."finding_status" AS ENUM('flagged', 'in_review', 'dispositioned', 'rework_done', 'verified', 'closed');--> statement-breakpoint
CREATE TABLE "organizations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"kind" "organization_kind" NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "users" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"email" text NOT NULL,
	"name" text NOT NULL,
	"role" "user_role" NOT NULL,
	"organization_id" uuid,
	"password_hash" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "users_email_unique" UNIQUE("email")
);
--> statement-breakpoint
CREATE TABLE "design_revisions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"part_design_id" uuid NOT NULL,
	"letter" text NOT NULL,
	"status" "revision_status" DEFAULT 'draft' NOT NULL,
	"material" text NOT NULL,
	"gauge_in" real NOT NULL,
	"rivet_spec" text NOT NULL,
	"drill_size" text NOT NULL,
	"drill_diameter_in" real NOT NULL,
	"edge_distance_in" real NOT NULL,
	"chord_in" real NOT NULL,
	"lines" jsonb NOT NULL,
	"steps" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"change_note" text DEFAULT '' NOT NULL,
	"basis" jsonb,
	"study_id" uuid,
	"created_by" uuid NOT NULL,
	"published_by" uuid,
	"published_at" timestamp with time zone,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "kit_models" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" uuid NOT NULL,
	"code" text NOT NULL,
	"name" text NOT NULL,
	"weight_lb" real NOT NULL,
	"wing_area_sq_ft" real NOT NULL,
	"mean_chord_in" real NOT NULL,
	"stall_speed_keas" real NOT NULL,
	"cruise_speed_keas" real,
	"category" "aircraft_category" DEFAULT 'normal' NOT NULL,
	"airfoil" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "part_designs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"kit_model_id" uuid NOT NULL,
	"part_number" text NOT NULL,
	"name" text NOT NULL,
	"kind" "part_kind" NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "build_members" (
	"build_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"role" "build_member_role" NOT NULL,
	CONSTRAINT "build_members_build_id_user_id_pk" PRIMARY KEY("build_id","user_id")
);
--> statement-breakpoint
CREATE TABLE "builds" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" uuid NOT NULL,
	"kit_model_id" uuid NOT NULL,
	"kit_serial" text NOT NULL,
	"created_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "builds_kit_serial_unique" UNIQUE("kit_serial")
);
--> statement-breakpoint
CREATE TABLE "holes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"traveler_id" uuid NOT NULL,
	"hole_id" text NOT NULL,
	"line" text NOT NULL,
	"seq" integer NOT NULL,
	"station_in" real NOT NULL,
	"status" "hole_status" DEFAULT 'pending' NOT NULL,
	"updated_by" uuid,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "traveler_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"traveler_id" uuid NOT NULL,
	"actor_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"detail" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "traveler_steps" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"traveler_id" uuid NOT NULL,
	"seq" integer NOT NULL,
	"text" text NOT NULL,
	"done_by" uuid,
	"done_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "travelers" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"build_id" uuid NOT NULL,
	"revision_id" uuid NOT NULL,
	"serial" text NOT NULL,
	"qr_token" text NOT NULL,
	"short_code" text NOT NULL,
	"signed_off_by" uuid,
	"signed_off_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "travelers_serial_unique" UNIQUE("serial"),
	CONSTRAINT "travelers_qr_token_unique" UNIQUE("qr_token"),
	CONSTRAINT "travelers_short_code_unique" UNIQUE("short_code")
);
--> statement-breakpoint
CREATE TABLE "finding_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"finding_id" uuid NOT NULL,
	"actor_id" uuid NOT NULL,
	"from_status" "finding_status",
	"to_status" "finding_status" NOT NULL,
	"disposition" "disposition",
	"note" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "finding_photos" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"finding_id" uuid NOT NULL,
	"file_key" text NOT NULL,
	"thumb_key" text NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"uploaded_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "findings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"traveler_id" uuid NOT NULL,
	"hole_ids" text[] NOT NULL,
	"kind" "finding_kind" NOT NULL,
	"note" text NOT NULL,
	"status" "finding_status" DEFAULT 'flagged' NOT NULL,
	"disposition" "disposition",
	"disposition_note" text,
	"flagged_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sent_mails" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"event_id" uuid NOT NULL,
	"recipient" text NOT NULL,
	"subject" text NOT NULL,
	"attempts" integer DEFAULT 1 NOT NULL,
	"sent_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "users" ADD CONSTRAINT "users_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "design_revisions" ADD CONSTRAINT "design_revisions_part_design_id_part_designs_id_fk" FOREIGN KEY ("part_design_id") REFERENCES "public"."part_designs"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "design_revisions" ADD CONSTRAINT "design_revisions_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "design_revisions" ADD CONSTRAINT "design_revisions_published_by_users_id_fk" FOREIGN KEY ("published_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kit_models" ADD CONSTRAINT "kit_models_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_designs" ADD CONSTRAINT "part_designs_kit_model_id_kit_models_id_fk" FOREIGN KEY ("kit_model_id") REFERENCES "public"."kit_models"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "build_members" ADD CONSTRAINT "build_members_build_id_builds_id_fk" FOREIGN KEY ("build_id") REFERENCES "public"."builds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "build_members" ADD CONSTRAINT "build_members_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "builds" ADD CONSTRAINT "builds_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "builds" ADD CONSTRAINT "builds_kit_model_id_kit_models_id_fk" FOREIGN KEY ("kit_model_id") REFERENCES "public"."kit_models"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "builds" ADD CONSTRAINT "builds_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "holes" ADD CONSTRAINT "holes_traveler_id_travelers_id_fk" FOREIGN KEY ("traveler_id") REFERENCES "public"."travelers"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "holes" ADD CONSTRAINT "holes_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "traveler_events" ADD CONSTRAINT "traveler_events_traveler_id_travelers_id_fk" FOREIGN KEY ("traveler_id") REFERENCES "public"."travelers"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "traveler_events" ADD CONSTRAINT "traveler_events_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "traveler_steps" ADD CONSTRAINT "traveler_steps_traveler_id_travelers_id_fk" FOREIGN KEY ("traveler_id") REFERENCES "public"."travelers"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "traveler_steps" ADD CONSTRAINT "traveler_steps_done_by_users_id_fk" FOREIGN KEY ("done_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "travelers" ADD CONSTRAINT "travelers_build_id_builds_id_fk" FOREIGN KEY ("build_id") REFERENCES "public"."builds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "travelers" ADD CONSTRAINT "travelers_revision_id_design_revisions_id_fk" FOREIGN KEY ("revision_id") REFERENCES "public"."design_revisions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "travelers" ADD CONSTRAINT "travelers_signed_off_by_users_id_fk" FOREIGN KEY ("signed_off_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "finding_events" ADD CONSTRAINT "finding_events_finding_id_findings_id_fk" FOREIGN KEY ("finding_id") REFERENCES "public"."findings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "finding_events" ADD CONSTRAINT "finding_events_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "finding_photos" ADD CONSTRAINT "finding_photos_finding_id_findings_id_fk" FOREIGN KEY ("finding_id") REFERENCES "public"."findings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "finding_photos" ADD CONSTRAINT "finding_photos_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_traveler_id_travelers_id_fk" FOREIGN KEY ("traveler_id") REFERENCES "public"."travelers"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_flagged_by_users_id_fk" FOREIGN KEY ("flagged_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sent_mails" ADD CONSTRAINT "sent_mails_event_id_finding_events_id_fk" FOREIGN KEY ("event_id") REFERENCES "public"."finding_events"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "design_revisions_design_letter" ON "design_revisions" USING btree ("part_design_id","letter");--> statement-breakpoint
CREATE UNIQUE INDEX "kit_models_org_code" ON "kit_models" USING btree ("organization_id","code");--> statement-breakpoint
CREATE UNIQUE INDEX "part_designs_kit_number" ON "part_designs" USING btree ("kit_model_id","part_number");--> statement-breakpoint
CREATE UNIQUE INDEX "holes_traveler_hole" ON "holes" USING btree ("traveler_id","hole_id");--> statement-breakpoint
CREATE INDEX "traveler_events_traveler" ON "traveler_events" USING btree ("traveler_id","created_at");--> statement-breakpoint
CREATE INDEX "travelers_build" ON "travelers" USING btree ("build_id");--> statement-breakpoint
CREATE INDEX "finding_events_finding" ON "finding_events" USING btree ("finding_id","created_at");--> statement-breakpoint
CREATE INDEX "findings_traveler" ON "findings" USING btree ("traveler_id");--> statement-breakpoint
CREATE INDEX "findings_status" ON "findings" USING btree ("status");--> statement-breakpoint
CREATE UNIQUE INDEX "sent_mails_event_recipient" ON "sent_mails" USING btree ("event_id","recipient");