CREATE TYPE "public"."reminder_channel" AS ENUM('email-step', 'email-digest');--> statement-breakpoint
CREATE TYPE "public"."reminder_mode" AS ENUM('each-step', 'weekly-digest', 'off');--> statement-breakpoint
CREATE TYPE "public"."reminder_state" AS ENUM('due', 'sending', 'sent', 'failed', 'skipped');--> statement-breakpoint
CREATE TABLE "calendar_feeds" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "calendar_feeds_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"user_id" integer NOT NULL,
	"plant_id" integer,
	"token_hash" text NOT NULL,
	"revoked_at" timestamp with time zone,
	"ics" text,
	"etag" text,
	"last_modified" timestamp with time zone,
	"rendered_version" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "reminder_preferences" (
	"user_id" integer PRIMARY KEY NOT NULL,
	"mode" "reminder_mode" DEFAULT 'each-step' NOT NULL,
	"hour" integer DEFAULT 8 NOT NULL,
	"time_zone" text NOT NULL,
	"unsubscribe_token" text NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "reminders" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "reminders_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"step_id" integer,
	"plant_id" integer NOT NULL,
	"user_id" integer NOT NULL,
	"channel" "reminder_channel" NOT NULL,
	"due_at" timestamp with time zone NOT NULL,
	"state" "reminder_state" DEFAULT 'due' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"last_error" text,
	"message_id" text,
	"title" text NOT NULL,
	"retry_at" timestamp with time zone,
	"queued_at" timestamp with time zone,
	"claimed_at" timestamp with time zone,
	"sent_at" timestamp with time zone,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "calendar_feeds" ADD CONSTRAINT "calendar_feeds_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "calendar_feeds" ADD CONSTRAINT "calendar_feeds_plant_id_plants_id_fk" FOREIGN KEY ("plant_id") REFERENCES "public"."plants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reminder_preferences" ADD CONSTRAINT "reminder_preferences_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reminders" ADD CONSTRAINT "reminders_step_id_plan_steps_id_fk" FOREIGN KEY ("step_id") REFERENCES "public"."plan_steps"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reminders" ADD CONSTRAINT "reminders_plant_id_plants_id_fk" FOREIGN KEY ("plant_id") REFERENCES "public"."plants"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reminders" ADD CONSTRAINT "reminders_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "calendar_feeds_token_key" ON "calendar_feeds" USING btree ("token_hash");--> statement-breakpoint
CREATE INDEX "calendar_feeds_user_idx" ON "calendar_feeds" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "calendar_feeds_plant_idx" ON "calendar_feeds" USING btree ("plant_id");--> statement-breakpoint
CREATE UNIQUE INDEX "reminder_preferences_unsubscribe_key" ON "reminder_preferences" USING btree ("unsubscribe_token");--> statement-breakpoint
CREATE UNIQUE INDEX "reminders_step_channel_due_key" ON "reminders" USING btree ("step_id","channel","due_at");--> statement-breakpoint
CREATE INDEX "reminders_pending_idx" ON "reminders" USING btree ("due_at") WHERE state in ('due', 'sending');--> statement-breakpoint
CREATE INDEX "reminders_plant_idx" ON "reminders" USING btree ("plant_id","due_at");--> statement-breakpoint
CREATE INDEX "reminders_user_idx" ON "reminders" USING btree ("user_id","due_at");--> statement-breakpoint
CREATE INDEX "reminders_state_updated_idx" ON "reminders" USING btree ("state","updated_at");