CREATE TABLE "share_scenarios" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"study_id" uuid NOT NULL,
	"name" text NOT NULL,
	"alternatives" jsonb NOT NULL,
	"include_fixed" boolean DEFAULT true NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "share_scenarios" ADD CONSTRAINT "share_scenarios_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "share_scenarios" ADD CONSTRAINT "share_scenarios_study_id_studies_id_fk" FOREIGN KEY ("study_id") REFERENCES "public"."studies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "share_scenarios" ADD CONSTRAINT "share_scenarios_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "share_scenarios_team_idx" ON "share_scenarios" USING btree ("team_id");--> statement-breakpoint
CREATE UNIQUE INDEX "share_scenarios_study_name_idx" ON "share_scenarios" USING btree ("study_id","name");