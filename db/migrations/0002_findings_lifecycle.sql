CREATE TYPE "public"."replaced_reason" AS ENUM('scrap', 'return_to_supplier');--> statement-breakpoint
CREATE TYPE "public"."build_place" AS ENUM('builder', 'inspector', 'design_authority', 'none');--> statement-breakpoint
CREATE TYPE "public"."finding_closure" AS ENUM('accepted', 'use_as_is', 'not_a_defect', 'scrapped', 'returned');--> statement-breakpoint
CREATE TYPE "public"."finding_event_action" AS ENUM('raise', 'disposition', 'amend', 'not-a-defect', 'approve', 'refuse', 'report-done', 'accept', 'send-back', 'part-replaced');--> statement-breakpoint
ALTER TABLE "findings" RENAME COLUMN "flagged_by" TO "raised_by";--> statement-breakpoint
ALTER TABLE "findings" DROP CONSTRAINT "findings_flagged_by_users_id_fk";
--> statement-breakpoint
ALTER TABLE "finding_events" ALTER COLUMN "disposition" SET DATA TYPE text;--> statement-breakpoint
ALTER TABLE "findings" ALTER COLUMN "disposition" SET DATA TYPE text;--> statement-breakpoint
DROP TYPE "public"."disposition";--> statement-breakpoint
CREATE TYPE "public"."disposition" AS ENUM('rework', 'repair', 'use_as_is', 'scrap', 'return_to_supplier');--> statement-breakpoint
ALTER TABLE "finding_events" ALTER COLUMN "disposition" SET DATA TYPE "public"."disposition" USING "disposition"::"public"."disposition";--> statement-breakpoint
ALTER TABLE "findings" ALTER COLUMN "disposition" SET DATA TYPE "public"."disposition" USING "disposition"::"public"."disposition";--> statement-breakpoint
ALTER TABLE "findings" ALTER COLUMN "kind" SET DATA TYPE text;--> statement-breakpoint
DROP TYPE "public"."finding_kind";--> statement-breakpoint
CREATE TYPE "public"."finding_kind" AS ENUM('hole_elongated', 'hole_oversize', 'hole_burrs', 'hole_cracked', 'hole_edge_short', 'hole_mislocated', 'shop_head_small', 'shop_head_flat_or_tall', 'shop_head_clinched', 'shop_head_cracked', 'head_not_seated', 'head_proud', 'countersink_too_deep', 'dimple_cracked', 'blind_stem', 'blind_head_gap', 'blind_wrong_grip', 'sheet_deformed_flange', 'sheet_gap', 'fastener_wrong_or_missing');--> statement-breakpoint
ALTER TABLE "findings" ALTER COLUMN "kind" SET DATA TYPE "public"."finding_kind" USING "kind"::"public"."finding_kind";--> statement-breakpoint
ALTER TABLE "finding_events" ALTER COLUMN "from_status" SET DATA TYPE text;--> statement-breakpoint
ALTER TABLE "finding_events" ALTER COLUMN "to_status" SET DATA TYPE text;--> statement-breakpoint
ALTER TABLE "findings" ALTER COLUMN "status" SET DATA TYPE text;--> statement-breakpoint
ALTER TABLE "findings" ALTER COLUMN "status" SET DEFAULT 'raised'::text;--> statement-breakpoint
DROP TYPE "public"."finding_status";--> statement-breakpoint
CREATE TYPE "public"."finding_status" AS ENUM('raised', 'awaiting_approval', 'work_ordered', 'work_done', 'closed');--> statement-breakpoint
ALTER TABLE "finding_events" ALTER COLUMN "from_status" SET DATA TYPE "public"."finding_status" USING "from_status"::"public"."finding_status";--> statement-breakpoint
ALTER TABLE "finding_events" ALTER COLUMN "to_status" SET DATA TYPE "public"."finding_status" USING "to_status"::"public"."finding_status";--> statement-breakpoint
ALTER TABLE "findings" ALTER COLUMN "status" SET DEFAULT 'raised'::"public"."finding_status";--> statement-breakpoint
ALTER TABLE "findings" ALTER COLUMN "status" SET DATA TYPE "public"."finding_status" USING "status"::"public"."finding_status";--> statement-breakpoint
ALTER TABLE "travelers" ADD COLUMN "replaced_by_id" uuid;--> statement-breakpoint
ALTER TABLE "travelers" ADD COLUMN "replaced_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "travelers" ADD COLUMN "replaced_reason" "replaced_reason";--> statement-breakpoint
ALTER TABLE "travelers" ADD COLUMN "replaces_id" uuid;--> statement-breakpoint
ALTER TABLE "finding_events" ADD COLUMN "action" "finding_event_action" NOT NULL;--> statement-breakpoint
ALTER TABLE "finding_events" ADD COLUMN "actor_place" "build_place" NOT NULL;--> statement-breakpoint
ALTER TABLE "finding_photos" ADD COLUMN "event_id" uuid;--> statement-breakpoint
ALTER TABLE "findings" ADD COLUMN "holes_before" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "findings" ADD COLUMN "measurements" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "findings" ADD COLUMN "repair" jsonb;--> statement-breakpoint
ALTER TABLE "findings" ADD COLUMN "closure" "finding_closure";--> statement-breakpoint
ALTER TABLE "findings" ADD COLUMN "work_reported_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "travelers" ADD CONSTRAINT "travelers_replaced_by_id_travelers_id_fk" FOREIGN KEY ("replaced_by_id") REFERENCES "public"."travelers"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "travelers" ADD CONSTRAINT "travelers_replaces_id_travelers_id_fk" FOREIGN KEY ("replaces_id") REFERENCES "public"."travelers"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "finding_photos" ADD CONSTRAINT "finding_photos_event_id_finding_events_id_fk" FOREIGN KEY ("event_id") REFERENCES "public"."finding_events"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "findings" ADD CONSTRAINT "findings_raised_by_users_id_fk" FOREIGN KEY ("raised_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;