CREATE TABLE "run_checkpoints" (
	"run_id" uuid PRIMARY KEY NOT NULL,
	"attempt" integer NOT NULL,
	"data_hash" text NOT NULL,
	"iteration" integer NOT NULL,
	"start" integer NOT NULL,
	"state" jsonb NOT NULL,
	"saved_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "run_checkpoints" ADD CONSTRAINT "run_checkpoints_run_id_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."runs"("id") ON DELETE cascade ON UPDATE no action;