CREATE TABLE "answer_revisions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"answer_id" uuid NOT NULL,
	"respondent_id" uuid NOT NULL,
	"study_id" uuid NOT NULL,
	"screen_key" text NOT NULL,
	"client_id" text NOT NULL,
	"task_number" integer,
	"chosen_alternative" integer,
	"chosen_position" integer,
	"value" jsonb,
	"response_ms" integer,
	"answered_at" timestamp with time zone NOT NULL,
	"replaced_at" timestamp with time zone NOT NULL
);
--> statement-breakpoint
ALTER TABLE "answers" ADD COLUMN "revision_count" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "answers" ADD COLUMN "revised_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "answer_revisions" ADD CONSTRAINT "answer_revisions_answer_id_answers_id_fk" FOREIGN KEY ("answer_id") REFERENCES "public"."answers"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "answer_revisions" ADD CONSTRAINT "answer_revisions_respondent_id_respondents_id_fk" FOREIGN KEY ("respondent_id") REFERENCES "public"."respondents"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "answer_revisions" ADD CONSTRAINT "answer_revisions_study_id_studies_id_fk" FOREIGN KEY ("study_id") REFERENCES "public"."studies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "answer_revisions_respondent_client_uq" ON "answer_revisions" USING btree ("respondent_id","client_id");--> statement-breakpoint
CREATE INDEX "answer_revisions_study_idx" ON "answer_revisions" USING btree ("study_id");