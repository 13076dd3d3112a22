DROP INDEX "respondents_invitee_idx";--> statement-breakpoint
ALTER TABLE "respondents" ADD COLUMN "panel_key" text;--> statement-breakpoint
-- Links opened on two devices before this index existed: the first respondent keeps the
-- invitee, later ones keep their answers but lose the link to it.
UPDATE "respondents" r SET "invitee_id" = NULL
 WHERE r."invitee_id" IS NOT NULL
   AND EXISTS (SELECT 1 FROM "respondents" e
                WHERE e."invitee_id" = r."invitee_id"
                  AND (e."started_at", e."id") < (r."started_at", r."id"));--> statement-breakpoint
CREATE UNIQUE INDEX "respondents_invitee_uq" ON "respondents" USING btree ("invitee_id");--> statement-breakpoint
CREATE UNIQUE INDEX "respondents_study_panel_key_uq" ON "respondents" USING btree ("study_id","panel_key");