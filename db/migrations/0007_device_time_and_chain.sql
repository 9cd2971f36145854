CREATE TABLE "log_chain" (
	"build_id" uuid NOT NULL,
	"seq" integer NOT NULL,
	"source" text NOT NULL,
	"event_id" uuid NOT NULL,
	"hash" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "log_chain_build_id_seq_pk" PRIMARY KEY("build_id","seq")
);
--> statement-breakpoint
DROP INDEX "build_events_build";--> statement-breakpoint
DROP INDEX "traveler_events_traveler";--> statement-breakpoint
ALTER TABLE "build_events" ADD COLUMN "done_at" timestamp with time zone DEFAULT now() NOT NULL;--> statement-breakpoint
ALTER TABLE "build_events" ADD COLUMN "clock_offset_ms" integer;--> statement-breakpoint
-- What was written before device times: done when it arrived.
UPDATE "build_events" SET "done_at" = "created_at";--> statement-breakpoint
ALTER TABLE "traveler_events" ADD COLUMN "done_at" timestamp with time zone DEFAULT now() NOT NULL;--> statement-breakpoint
ALTER TABLE "traveler_events" ADD COLUMN "clock_offset_ms" integer;--> statement-breakpoint
-- What was written before device times: done when it arrived.
UPDATE "traveler_events" SET "done_at" = "created_at";--> statement-breakpoint
ALTER TABLE "log_chain" ADD CONSTRAINT "log_chain_build_id_builds_id_fk" FOREIGN KEY ("build_id") REFERENCES "public"."builds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "log_chain_event" ON "log_chain" USING btree ("source","event_id");--> statement-breakpoint
CREATE INDEX "build_events_build" ON "build_events" USING btree ("build_id","done_at","id");--> statement-breakpoint
CREATE INDEX "traveler_events_traveler" ON "traveler_events" USING btree ("traveler_id","done_at","id");