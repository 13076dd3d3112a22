CREATE TABLE "respondent_block_counts" (
	"version_id" uuid PRIMARY KEY NOT NULL,
	"filling" integer[] NOT NULL,
	"last_block" integer DEFAULT 0 NOT NULL
);
--> statement-breakpoint
ALTER TABLE "respondent_block_counts" ADD CONSTRAINT "respondent_block_counts_version_id_study_versions_id_fk" FOREIGN KEY ("version_id") REFERENCES "public"."study_versions"("id") ON DELETE cascade ON UPDATE no action;