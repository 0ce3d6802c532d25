CREATE TABLE "catalogue_version" (
	"id" integer PRIMARY KEY DEFAULT 1 NOT NULL,
	"version" integer DEFAULT 0 NOT NULL,
	"changed_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "nursery_settings" ADD COLUMN "full_ration_g" real DEFAULT 907.18474 NOT NULL;--> statement-breakpoint
ALTER TABLE "nursery_settings" ADD COLUMN "handful_g" real DEFAULT 100 NOT NULL;--> statement-breakpoint
ALTER TABLE "climate_profiles" ADD COLUMN "updated_at" timestamp with time zone DEFAULT now() NOT NULL;