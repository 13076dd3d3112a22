ALTER TABLE "studies" ADD COLUMN "public_title" text DEFAULT '' NOT NULL;--> statement-breakpoint
-- Studies made before the public title existed show their name, as they did until now.
UPDATE "studies" SET "public_title" = "name" WHERE "public_title" = '';
