DROP INDEX "plants_cultivar_idx";--> statement-breakpoint
DROP INDEX "plants_stage_idx";--> statement-breakpoint
CREATE INDEX "plants_sold_on_idx" ON "plants" USING btree ("sold_on","id");--> statement-breakpoint
CREATE INDEX "plants_last_milestone_idx" ON "plants" USING btree ("last_milestone_on","id");--> statement-breakpoint
CREATE INDEX "plants_started_idx" ON "plants" USING btree (("sold_on" - "age_at_sale_weeks" * 7),"id");--> statement-breakpoint
CREATE INDEX "plants_cultivar_idx" ON "plants" USING btree ("cultivar_id","next_step_on","id");--> statement-breakpoint
CREATE INDEX "plants_stage_idx" ON "plants" USING btree ("stage","next_step_on","id");