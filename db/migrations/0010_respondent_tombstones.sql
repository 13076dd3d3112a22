CREATE TABLE "respondent_tombstones" (
	"id" uuid PRIMARY KEY NOT NULL,
	"study_id" uuid NOT NULL,
	"started_at" timestamp with time zone NOT NULL,
	"erased_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "respondent_tombstones" ADD CONSTRAINT "respondent_tombstones_study_id_studies_id_fk" FOREIGN KEY ("study_id") REFERENCES "public"."studies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "respondent_tombstones_study_idx" ON "respondent_tombstones" USING btree ("study_id","started_at");