CREATE TABLE "plan_steps" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "plan_steps_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"plant_id" integer NOT NULL,
	"uid" uuid DEFAULT gen_random_uuid() NOT NULL,
	"generation" integer NOT NULL,
	"kind" text NOT NULL,
	"occurrence" integer DEFAULT 0 NOT NULL,
	"title" text NOT NULL,
	"detail" text DEFAULT '' NOT NULL,
	"earliest" date NOT NULL,
	"likely" date NOT NULL,
	"latest" date NOT NULL,
	"amount" jsonb,
	"nutrients" jsonb,
	"cautions" jsonb,
	"guide" text,
	"observed" boolean DEFAULT false NOT NULL,
	"restricted" boolean DEFAULT false NOT NULL,
	"sequence" integer DEFAULT 0 NOT NULL,
	"changed_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "plants" ADD COLUMN "stage" text;--> statement-breakpoint
ALTER TABLE "plants" ADD COLUMN "next_step_on" date;--> statement-breakpoint
ALTER TABLE "plants" ADD COLUMN "next_step_kind" text;--> statement-breakpoint
ALTER TABLE "plants" ADD COLUMN "last_milestone_on" date;--> statement-breakpoint
ALTER TABLE "plants" ADD COLUMN "last_milestone_kind" text;--> statement-breakpoint
ALTER TABLE "plants" ADD COLUMN "plan_changed_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "plan_steps" ADD CONSTRAINT "plan_steps_plant_id_plants_id_fk" FOREIGN KEY ("plant_id") REFERENCES "public"."plants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "plan_steps_identity_key" ON "plan_steps" USING btree ("plant_id","generation","kind","occurrence");--> statement-breakpoint
CREATE UNIQUE INDEX "plan_steps_uid_key" ON "plan_steps" USING btree ("uid");--> statement-breakpoint
CREATE INDEX "plan_steps_plant_likely_idx" ON "plan_steps" USING btree ("plant_id","likely");--> statement-breakpoint
CREATE INDEX "plants_next_step_idx" ON "plants" USING btree ("next_step_on","id");--> statement-breakpoint
CREATE INDEX "plants_stage_idx" ON "plants" USING btree ("stage","next_step_on");