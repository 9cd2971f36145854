CREATE TYPE "public"."step_kind" AS ENUM('lay_out', 'drill', 'deburr', 'dimple_countersink', 'prime', 'rivet', 'inspect', 'other');--> statement-breakpoint
CREATE TYPE "public"."step_performer" AS ENUM('builder', 'helper', 'commercial', 'kit_supplier');--> statement-breakpoint
CREATE TABLE "work_sessions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"traveler_id" uuid NOT NULL,
	"person_id" uuid NOT NULL,
	"performer" "step_performer" DEFAULT 'builder' NOT NULL,
	"performer_name" text,
	"started_at" timestamp with time zone NOT NULL,
	"ended_at" timestamp with time zone,
	"entered" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "traveler_steps" ADD COLUMN "kind" "step_kind" DEFAULT 'other' NOT NULL;--> statement-breakpoint
ALTER TABLE "traveler_steps" ADD COLUMN "inspection_point" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "traveler_steps" ADD COLUMN "performer" "step_performer";--> statement-breakpoint
ALTER TABLE "traveler_steps" ADD COLUMN "performer_name" text;--> statement-breakpoint
ALTER TABLE "traveler_steps" ADD COLUMN "stamped_by" uuid;--> statement-breakpoint
ALTER TABLE "traveler_steps" ADD COLUMN "stamped_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "work_sessions" ADD CONSTRAINT "work_sessions_traveler_id_travelers_id_fk" FOREIGN KEY ("traveler_id") REFERENCES "public"."travelers"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_sessions" ADD CONSTRAINT "work_sessions_person_id_users_id_fk" FOREIGN KEY ("person_id") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "work_sessions_traveler" ON "work_sessions" USING btree ("traveler_id","started_at");--> statement-breakpoint
CREATE UNIQUE INDEX "work_sessions_running" ON "work_sessions" USING btree ("traveler_id","person_id") WHERE "work_sessions"."ended_at" is null;--> statement-breakpoint
ALTER TABLE "traveler_steps" ADD CONSTRAINT "traveler_steps_stamped_by_users_id_fk" FOREIGN KEY ("stamped_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
-- Steps done before steps said who did them were recorded by the builder at the bench.
UPDATE "traveler_steps" SET "performer" = 'builder' WHERE "done_at" IS NOT NULL;--> statement-breakpoint
-- Revision steps written as bare text become steps of kind "other" with no inspection point.
UPDATE "design_revisions" SET "steps" = (
	SELECT coalesce(jsonb_agg(jsonb_build_object('text', s.value, 'kind', 'other', 'inspectionPoint', false) ORDER BY s.ordinality), '[]'::jsonb)
	FROM jsonb_array_elements_text("steps") WITH ORDINALITY AS s(value, ordinality)
) WHERE jsonb_typeof("steps") = 'array' AND EXISTS (SELECT 1 FROM jsonb_array_elements("steps") e WHERE jsonb_typeof(e) = 'string');
