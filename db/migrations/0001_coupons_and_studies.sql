CREATE TYPE "public"."coupon_outcome" AS ENUM('no_deformation', 'slight_deformation', 'excessive_deformation', 'failure');--> statement-breakpoint
CREATE TABLE "coupon_tests" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" uuid NOT NULL,
	"material" text NOT NULL,
	"gauge_in" real NOT NULL,
	"coupon_width_in" real NOT NULL,
	"rivet_spec" text NOT NULL,
	"load_lb" real NOT NULL,
	"outcome" "coupon_outcome" NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"photo_key" text,
	"tested_on" date NOT NULL,
	"created_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "load_studies" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"organization_id" uuid NOT NULL,
	"kit_model_id" uuid NOT NULL,
	"name" text NOT NULL,
	"latest_revision" integer DEFAULT 1 NOT NULL,
	"created_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "load_study_revisions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"study_id" uuid NOT NULL,
	"revision" integer NOT NULL,
	"inputs" jsonb NOT NULL,
	"result" jsonb NOT NULL,
	"created_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "coupon_tests" ADD CONSTRAINT "coupon_tests_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "coupon_tests" ADD CONSTRAINT "coupon_tests_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "load_studies" ADD CONSTRAINT "load_studies_organization_id_organizations_id_fk" FOREIGN KEY ("organization_id") REFERENCES "public"."organizations"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "load_studies" ADD CONSTRAINT "load_studies_kit_model_id_kit_models_id_fk" FOREIGN KEY ("kit_model_id") REFERENCES "public"."kit_models"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "load_studies" ADD CONSTRAINT "load_studies_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "load_study_revisions" ADD CONSTRAINT "load_study_revisions_study_id_load_studies_id_fk" FOREIGN KEY ("study_id") REFERENCES "public"."load_studies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "load_study_revisions" ADD CONSTRAINT "load_study_revisions_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "coupon_tests_org_key" ON "coupon_tests" USING btree ("organization_id","material","gauge_in","rivet_spec");--> statement-breakpoint
CREATE INDEX "load_studies_org" ON "load_studies" USING btree ("organization_id");--> statement-breakpoint
CREATE UNIQUE INDEX "load_study_revisions_study_rev" ON "load_study_revisions" USING btree ("study_id","revision");