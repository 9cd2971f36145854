CREATE TYPE "public"."study_kind" AS ENUM('rib', 'wing');--> statement-breakpoint
ALTER TABLE "load_studies" ADD COLUMN "kind" "study_kind" DEFAULT 'rib' NOT NULL;