CREATE TABLE "question_photos" (
	"id" integer PRIMARY KEY GENERATED ALWAYS AS IDENTITY (sequence name "question_photos_id_seq" INCREMENT BY 1 MINVALUE 1 MAXVALUE 2147483647 START WITH 1 CACHE 1),
	"question_id" integer NOT NULL,
	"post_id" integer,
	"upload_id" integer NOT NULL,
	"position" integer NOT NULL
);
--> statement-breakpoint
ALTER TABLE "question_photos" ADD CONSTRAINT "question_photos_question_id_questions_id_fk" FOREIGN KEY ("question_id") REFERENCES "public"."questions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "question_photos" ADD CONSTRAINT "question_photos_post_id_question_posts_id_fk" FOREIGN KEY ("post_id") REFERENCES "public"."question_posts"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "question_photos" ADD CONSTRAINT "question_photos_upload_id_uploads_id_fk" FOREIGN KEY ("upload_id") REFERENCES "public"."uploads"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "question_photos_upload_key" ON "question_photos" USING btree ("upload_id");--> statement-breakpoint
CREATE INDEX "question_photos_question_idx" ON "question_photos" USING btree ("question_id","post_id","position");