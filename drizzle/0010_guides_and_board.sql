CREATE TYPE "public"."guide_status" AS ENUM('draft', 'published');--> statement-breakpoint
CREATE TYPE "public"."post_kind" AS ENUM('answer', 'reply');--> statement-breakpoint
CREATE TYPE "public"."question_state" AS ENUM('waiting', 'answered', 'resolved', 'hidden');--> statement-breakpoint
CREATE TABLE "guide_revisions" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "guide_revisions_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"guide_id" integer NOT NULL,
	"number" integer NOT NULL,
	"slug" text NOT NULL,
	"title" text NOT NULL,
	"summary" text NOT NULL,
	"body" text NOT NULL,
	"stages" text[] NOT NULL,
	"groups" text[] NOT NULL,
	"replaces" text,
	"author_id" integer,
	"restored_from" integer,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "guides" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "guides_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"slug" text NOT NULL,
	"title" text NOT NULL,
	"summary" text NOT NULL,
	"body" text NOT NULL,
	"body_html" text NOT NULL,
	"body_text" text NOT NULL,
	"stages" text[] DEFAULT '{}'::text[] NOT NULL,
	"groups" text[] DEFAULT '{}'::text[] NOT NULL,
	"replaces" text,
	"status" "guide_status" DEFAULT 'draft' NOT NULL,
	"author_id" integer,
	"source_question_id" integer,
	"published_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"search" "tsvector" GENERATED ALWAYS AS (setweight(to_tsvector('english', coalesce(title, '')), 'A') || setweight(to_tsvector('english', coalesce(summary, '')), 'B') || setweight(to_tsvector('english', coalesce(body_text, '')), 'C')) STORED NOT NULL
);
--> statement-breakpoint
CREATE TABLE "question_posts" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "question_posts_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"question_id" integer NOT NULL,
	"author_id" integer,
	"kind" "post_kind" NOT NULL,
	"body" text NOT NULL,
	"body_html" text NOT NULL,
	"body_text" text NOT NULL,
	"accepted" boolean DEFAULT false NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"search" "tsvector" GENERATED ALWAYS AS (to_tsvector('english', coalesce(body_text, ''))) STORED NOT NULL
);
--> statement-breakpoint
CREATE TABLE "questions" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "questions_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"asker_id" integer NOT NULL,
	"plant_id" integer,
	"title" text NOT NULL,
	"body" text NOT NULL,
	"body_html" text NOT NULL,
	"body_text" text NOT NULL,
	"is_public" boolean DEFAULT false NOT NULL,
	"state" "question_state" DEFAULT 'waiting' NOT NULL,
	"claimed_by_id" integer,
	"claimed_at" timestamp with time zone,
	"waiting_since" timestamp with time zone DEFAULT now() NOT NULL,
	"answered_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"search" "tsvector" GENERATED ALWAYS AS (setweight(to_tsvector('english', coalesce(title, '')), 'A') || setweight(to_tsvector('english', coalesce(body_text, '')), 'C')) STORED NOT NULL
);
--> statement-breakpoint
ALTER TABLE "guide_revisions" ADD CONSTRAINT "guide_revisions_guide_id_guides_id_fk" FOREIGN KEY ("guide_id") REFERENCES "public"."guides"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "guide_revisions" ADD CONSTRAINT "guide_revisions_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "guides" ADD CONSTRAINT "guides_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "guides" ADD CONSTRAINT "guides_source_question_id_questions_id_fk" FOREIGN KEY ("source_question_id") REFERENCES "public"."questions"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "question_posts" ADD CONSTRAINT "question_posts_question_id_questions_id_fk" FOREIGN KEY ("question_id") REFERENCES "public"."questions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "question_posts" ADD CONSTRAINT "question_posts_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "questions" ADD CONSTRAINT "questions_asker_id_users_id_fk" FOREIGN KEY ("asker_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "questions" ADD CONSTRAINT "questions_plant_id_plants_id_fk" FOREIGN KEY ("plant_id") REFERENCES "public"."plants"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "questions" ADD CONSTRAINT "questions_claimed_by_id_users_id_fk" FOREIGN KEY ("claimed_by_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "guide_revisions_number_key" ON "guide_revisions" USING btree ("guide_id","number");--> statement-breakpoint
CREATE UNIQUE INDEX "guides_slug_key" ON "guides" USING btree ("slug");--> statement-breakpoint
CREATE UNIQUE INDEX "guides_replaces_published_key" ON "guides" USING btree ("replaces") WHERE status = 'published' and replaces is not null;--> statement-breakpoint
CREATE INDEX "guides_status_idx" ON "guides" USING btree ("status","updated_at");--> statement-breakpoint
CREATE INDEX "guides_search_idx" ON "guides" USING gin ("search");--> statement-breakpoint
CREATE INDEX "question_posts_question_idx" ON "question_posts" USING btree ("question_id","created_at");--> statement-breakpoint
CREATE INDEX "question_posts_search_idx" ON "question_posts" USING gin ("search");--> statement-breakpoint
CREATE INDEX "questions_queue_idx" ON "questions" USING btree ("state","waiting_since");--> statement-breakpoint
CREATE INDEX "questions_asker_idx" ON "questions" USING btree ("asker_id","created_at");--> statement-breakpoint
CREATE INDEX "questions_public_idx" ON "questions" USING btree ("is_public","state","answered_at");--> statement-breakpoint
CREATE INDEX "questions_plant_idx" ON "questions" USING btree ("plant_id");--> statement-breakpoint
CREATE INDEX "questions_search_idx" ON "questions" USING gin ("search");