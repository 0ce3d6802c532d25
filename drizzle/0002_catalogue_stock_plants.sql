CREATE TABLE "climate_profiles" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "climate_profiles_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"slug" text NOT NULL,
	"name" text NOT NULL,
	"monthly_mean_c" jsonb NOT NULL,
	"source" jsonb NOT NULL,
	"built_in" boolean DEFAULT false NOT NULL,
	"created_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "cultivar_changes" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "cultivar_changes_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"cultivar_id" integer NOT NULL,
	"user_id" integer,
	"field" text NOT NULL,
	"old_value" jsonb,
	"new_value" jsonb,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "cultivars" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "cultivars_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"slug" text NOT NULL,
	"name" text NOT NULL,
	"group" text NOT NULL,
	"subgroup" text NOT NULL,
	"size" text NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"parameters" jsonb NOT NULL,
	"usual_price_cents" integer,
	"built_in" boolean DEFAULT false NOT NULL,
	"retired_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "waitlist_entries" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "waitlist_entries_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"cultivar_id" integer NOT NULL,
	"email" text NOT NULL,
	"leave_token_hash" text NOT NULL,
	"notified_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "market_days" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "market_days_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"on" date NOT NULL,
	"place" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sales" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "sales_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"client_id" uuid NOT NULL,
	"batch_id" integer,
	"cultivar_id" integer NOT NULL,
	"market_day_id" integer,
	"sold_on" date NOT NULL,
	"quantity" integer NOT NULL,
	"price_per_plant_cents" integer NOT NULL,
	"buyer_email" text,
	"sold_by" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "sales_quantity_positive" CHECK ("sales"."quantity" > 0),
	CONSTRAINT "sales_price_not_negative" CHECK ("sales"."price_per_plant_cents" >= 0)
);
--> statement-breakpoint
CREATE TABLE "stock_batches" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "stock_batches_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"cultivar_id" integer NOT NULL,
	"potted_on" date NOT NULL,
	"on_hand" integer NOT NULL,
	"market_day_id" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "stock_batches_on_hand_not_negative" CHECK ("stock_batches"."on_hand" >= 0)
);
--> statement-breakpoint
CREATE TABLE "stock_movements" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "stock_movements_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"batch_id" integer NOT NULL,
	"change" integer NOT NULL,
	"kind" text NOT NULL,
	"reason" text DEFAULT '' NOT NULL,
	"user_id" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "plants" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "plants_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"sale_id" integer,
	"cultivar_id" integer NOT NULL,
	"sold_on" date NOT NULL,
	"age_at_sale_weeks" integer NOT NULL,
	"claim_code_hash" text,
	"claim_version" integer DEFAULT 1 NOT NULL,
	"claimed_at" timestamp with time zone,
	"gardener_id" integer,
	"planted_on" date,
	"age_at_planting_weeks" integer,
	"climate_profile_id" integer,
	"custom_monthly_mean_c" jsonb,
	"units" text,
	"parent_plant_id" integer,
	"archived_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "climate_profiles" ADD CONSTRAINT "climate_profiles_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cultivar_changes" ADD CONSTRAINT "cultivar_changes_cultivar_id_cultivars_id_fk" FOREIGN KEY ("cultivar_id") REFERENCES "public"."cultivars"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cultivar_changes" ADD CONSTRAINT "cultivar_changes_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "waitlist_entries" ADD CONSTRAINT "waitlist_entries_cultivar_id_cultivars_id_fk" FOREIGN KEY ("cultivar_id") REFERENCES "public"."cultivars"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sales" ADD CONSTRAINT "sales_batch_id_stock_batches_id_fk" FOREIGN KEY ("batch_id") REFERENCES "public"."stock_batches"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sales" ADD CONSTRAINT "sales_cultivar_id_cultivars_id_fk" FOREIGN KEY ("cultivar_id") REFERENCES "public"."cultivars"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sales" ADD CONSTRAINT "sales_market_day_id_market_days_id_fk" FOREIGN KEY ("market_day_id") REFERENCES "public"."market_days"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sales" ADD CONSTRAINT "sales_sold_by_users_id_fk" FOREIGN KEY ("sold_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_batches" ADD CONSTRAINT "stock_batches_cultivar_id_cultivars_id_fk" FOREIGN KEY ("cultivar_id") REFERENCES "public"."cultivars"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_batches" ADD CONSTRAINT "stock_batches_market_day_id_market_days_id_fk" FOREIGN KEY ("market_day_id") REFERENCES "public"."market_days"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_movements" ADD CONSTRAINT "stock_movements_batch_id_stock_batches_id_fk" FOREIGN KEY ("batch_id") REFERENCES "public"."stock_batches"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_movements" ADD CONSTRAINT "stock_movements_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plants" ADD CONSTRAINT "plants_sale_id_sales_id_fk" FOREIGN KEY ("sale_id") REFERENCES "public"."sales"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plants" ADD CONSTRAINT "plants_cultivar_id_cultivars_id_fk" FOREIGN KEY ("cultivar_id") REFERENCES "public"."cultivars"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plants" ADD CONSTRAINT "plants_gardener_id_users_id_fk" FOREIGN KEY ("gardener_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plants" ADD CONSTRAINT "plants_climate_profile_id_climate_profiles_id_fk" FOREIGN KEY ("climate_profile_id") REFERENCES "public"."climate_profiles"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plants" ADD CONSTRAINT "plants_parent_plant_id_plants_id_fk" FOREIGN KEY ("parent_plant_id") REFERENCES "public"."plants"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "climate_profiles_slug_key" ON "climate_profiles" USING btree ("slug");--> statement-breakpoint
CREATE INDEX "cultivar_changes_cultivar_idx" ON "cultivar_changes" USING btree ("cultivar_id","created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "cultivars_slug_key" ON "cultivars" USING btree ("slug");--> statement-breakpoint
CREATE INDEX "cultivars_name_idx" ON "cultivars" USING btree ("name");--> statement-breakpoint
CREATE UNIQUE INDEX "waitlist_cultivar_email_key" ON "waitlist_entries" USING btree ("cultivar_id","email");--> statement-breakpoint
CREATE UNIQUE INDEX "waitlist_leave_token_key" ON "waitlist_entries" USING btree ("leave_token_hash");--> statement-breakpoint
CREATE INDEX "waitlist_pending_idx" ON "waitlist_entries" USING btree ("cultivar_id") WHERE notified_at is null;--> statement-breakpoint
CREATE UNIQUE INDEX "market_days_on_place_key" ON "market_days" USING btree ("on","place");--> statement-breakpoint
CREATE UNIQUE INDEX "sales_client_id_key" ON "sales" USING btree ("client_id");--> statement-breakpoint
CREATE INDEX "sales_sold_on_idx" ON "sales" USING btree ("sold_on");--> statement-breakpoint
CREATE INDEX "sales_market_day_idx" ON "sales" USING btree ("market_day_id");--> statement-breakpoint
CREATE INDEX "stock_batches_cultivar_idx" ON "stock_batches" USING btree ("cultivar_id");--> statement-breakpoint
CREATE INDEX "stock_batches_market_day_idx" ON "stock_batches" USING btree ("market_day_id");--> statement-breakpoint
CREATE INDEX "stock_movements_batch_idx" ON "stock_movements" USING btree ("batch_id","created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "plants_claim_code_key" ON "plants" USING btree ("claim_code_hash");--> statement-breakpoint
CREATE INDEX "plants_gardener_idx" ON "plants" USING btree ("gardener_id");--> statement-breakpoint
CREATE INDEX "plants_sale_idx" ON "plants" USING btree ("sale_id");--> statement-breakpoint
CREATE INDEX "plants_cultivar_idx" ON "plants" USING btree ("cultivar_id");--> statement-breakpoint
CREATE INDEX "plants_parent_idx" ON "plants" USING btree ("parent_plant_id");