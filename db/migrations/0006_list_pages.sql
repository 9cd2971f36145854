DROP INDEX "findings_traveler";--> statement-breakpoint
DROP INDEX "findings_status";--> statement-breakpoint
DROP INDEX "coupon_tests_org_key";--> statement-breakpoint
DROP INDEX "load_studies_org";--> statement-breakpoint
DROP INDEX "build_events_build";--> statement-breakpoint
DROP INDEX "traveler_events_traveler";--> statement-breakpoint
DROP INDEX "finding_events_finding";--> statement-breakpoint
CREATE INDEX "organizations_name" ON "organizations" USING btree ("name","id");--> statement-breakpoint
CREATE INDEX "invitations_created" ON "invitations" USING btree ("created_at","id");--> statement-breakpoint
CREATE INDEX "invitations_org_created" ON "invitations" USING btree ("organization_id","created_at","id");--> statement-breakpoint
CREATE INDEX "users_name" ON "users" USING btree ("name","id");--> statement-breakpoint
CREATE INDEX "users_org_name" ON "users" USING btree ("organization_id","name","id");--> statement-breakpoint
CREATE INDEX "design_revisions_design_created" ON "design_revisions" USING btree ("part_design_id","created_at");--> statement-breakpoint
CREATE INDEX "part_designs_number" ON "part_designs" USING btree ("part_number","id");--> statement-breakpoint
CREATE INDEX "build_members_user" ON "build_members" USING btree ("user_id","role");--> statement-breakpoint
CREATE INDEX "builds_created" ON "builds" USING btree ("created_at","id");--> statement-breakpoint
CREATE INDEX "builds_org_created" ON "builds" USING btree ("organization_id","created_at","id");--> statement-breakpoint
CREATE INDEX "travelers_list_order" ON "travelers" USING btree (("replaced_by_id" is not null),"serial","id");--> statement-breakpoint
CREATE INDEX "finding_photos_finding" ON "finding_photos" USING btree ("finding_id","created_at","id");--> statement-breakpoint
CREATE INDEX "findings_created" ON "findings" USING btree ("created_at","id");--> statement-breakpoint
CREATE INDEX "findings_open_created" ON "findings" USING btree ("created_at","id") WHERE "findings"."status" <> 'closed';--> statement-breakpoint
CREATE INDEX "findings_status_created" ON "findings" USING btree ("status","created_at","id");--> statement-breakpoint
CREATE INDEX "findings_traveler_created" ON "findings" USING btree ("traveler_id","created_at","id");--> statement-breakpoint
CREATE INDEX "coupon_tests_org_order" ON "coupon_tests" USING btree ("organization_id","material","gauge_in","rivet_spec","load_lb","created_at","id");--> statement-breakpoint
CREATE INDEX "coupon_tests_superseded_by" ON "coupon_tests" USING btree ("superseded_by_id");--> statement-breakpoint
CREATE INDEX "load_studies_org_updated" ON "load_studies" USING btree ("organization_id","updated_at","id");--> statement-breakpoint
CREATE INDEX "build_events_build" ON "build_events" USING btree ("build_id","created_at","id");--> statement-breakpoint
CREATE INDEX "traveler_events_traveler" ON "traveler_events" USING btree ("traveler_id","created_at","id");--> statement-breakpoint
CREATE INDEX "finding_events_finding" ON "finding_events" USING btree ("finding_id","created_at","id");