CREATE TYPE "public"."loss_reason" AS ENUM('cold', 'wind', 'disease', 'other');--> statement-breakpoint
CREATE TYPE "public"."milestone_kind" AS ENUM('leaves', 'followers', 'flag-leaf', 'shooting', 'harvest', 'cut-back', 'stem-removed', 'division', 'lost');--> statement-breakpoint
CREATE TABLE "uploads" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "uploads_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"owner_id" integer NOT NULL,
	"purpose" text NOT NULL,
	"storage_key" text NOT NULL,
	"content_type" text NOT NULL,
	"bytes" integer NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "milestones" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "milestones_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"plant_id" integer NOT NULL,
	"generation" integer DEFAULT 0 NOT NULL,
	"kind" "milestone_kind" NOT NULL,
	"on" date NOT NULL,
	"leaves" integer,
	"hands" integer,
	"bunch_mass_g" integer,
	"loss_reason" "loss_reason",
	"note" text DEFAULT '' NOT NULL,
	"photo_id" integer,
	"divided_plant_id" integer,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "plan_changes" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "plan_changes_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"plant_id" integer NOT NULL,
	"changed_at" timestamp with time zone NOT NULL,
	"step_uid" uuid NOT NULL,
	"generation" integer NOT NULL,
	"kind" text NOT NULL,
	"occurrence" integer NOT NULL,
	"from_likely" date NOT NULL,
	"to_likely" date NOT NULL,
	"days" integer NOT NULL,
	"cause" jsonb NOT NULL
);
--> statement-breakpoint
ALTER TABLE "uploads" ADD CONSTRAINT "uploads_owner_id_users_id_fk" FOREIGN KEY ("owner_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "milestones" ADD CONSTRAINT "milestones_plant_id_plants_id_fk" FOREIGN KEY ("plant_id") REFERENCES "public"."plants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "milestones" ADD CONSTRAINT "milestones_photo_id_uploads_id_fk" FOREIGN KEY ("photo_id") REFERENCES "public"."uploads"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "milestones" ADD CONSTRAINT "milestones_divided_plant_id_plants_id_fk" FOREIGN KEY ("divided_plant_id") REFERENCES "public"."plants"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "milestones" ADD CONSTRAINT "milestones_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plan_changes" ADD CONSTRAINT "plan_changes_plant_id_plants_id_fk" FOREIGN KEY ("plant_id") REFERENCES "public"."plants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "uploads_storage_key_key" ON "uploads" USING btree ("storage_key");--> statement-breakpoint
CREATE INDEX "uploads_owner_idx" ON "uploads" USING btree ("owner_id");--> statement-breakpoint
CREATE INDEX "milestones_plant_idx" ON "milestones" USING btree ("plant_id","on");--> statement-breakpoint
CREATE INDEX "milestones_photo_idx" ON "milestones" USING btree ("photo_id");--> statement-breakpoint
CREATE INDEX "milestones_divided_plant_idx" ON "milestones" USING btree ("divided_plant_id");--> statement-breakpoint
CREATE INDEX "plan_changes_plant_idx" ON "plan_changes" USING btree ("plant_id","changed_at");