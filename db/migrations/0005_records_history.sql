CREATE TABLE "kit_model_changes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"kit_model_id" uuid NOT NULL,
	"changed_by" uuid NOT NULL,
	"reason" text DEFAULT '' NOT NULL,
	"before" jsonb NOT NULL,
	"after" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "builds" ADD COLUMN "note" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "coupon_tests" ADD COLUMN "correction_reason" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "coupon_tests" ADD COLUMN "superseded_by_id" uuid;--> statement-breakpoint
ALTER TABLE "coupon_tests" ADD COLUMN "superseded_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "kit_model_changes" ADD CONSTRAINT "kit_model_changes_kit_model_id_kit_models_id_fk" FOREIGN KEY ("kit_model_id") REFERENCES "public"."kit_models"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "kit_model_changes" ADD CONSTRAINT "kit_model_changes_changed_by_users_id_fk" FOREIGN KEY ("changed_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "kit_model_changes_kit" ON "kit_model_changes" USING btree ("kit_model_id","created_at");--> statement-breakpoint
ALTER TABLE "coupon_tests" ADD CONSTRAINT "coupon_tests_superseded_by_id_coupon_tests_id_fk" FOREIGN KEY ("superseded_by_id") REFERENCES "public"."coupon_tests"("id") ON DELETE no action ON UPDATE no action;