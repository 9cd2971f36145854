CREATE TABLE "work_photos" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"traveler_id" uuid NOT NULL,
	"event_id" uuid NOT NULL,
	"step_id" uuid,
	"hole_ids" text[] DEFAULT '{}' NOT NULL,
	"file_key" text NOT NULL,
	"thumb_key" text NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"uploaded_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "work_photos" ADD CONSTRAINT "work_photos_traveler_id_travelers_id_fk" FOREIGN KEY ("traveler_id") REFERENCES "public"."travelers"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_photos" ADD CONSTRAINT "work_photos_event_id_traveler_events_id_fk" FOREIGN KEY ("event_id") REFERENCES "public"."traveler_events"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_photos" ADD CONSTRAINT "work_photos_step_id_traveler_steps_id_fk" FOREIGN KEY ("step_id") REFERENCES "public"."traveler_steps"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_photos" ADD CONSTRAINT "work_photos_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "work_photos_event" ON "work_photos" USING btree ("event_id");--> statement-breakpoint
CREATE INDEX "work_photos_traveler" ON "work_photos" USING btree ("traveler_id");