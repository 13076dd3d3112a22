-- Accounts that existed before e-mail confirmation are taken as confirmed.
UPDATE "users" SET "email_verified_at" = "created_at" WHERE "email_verified_at" IS NULL;
--> statement-breakpoint
-- The audit trail is append-only: no UPDATE, DELETE or TRUNCATE, whoever asks.
CREATE OR REPLACE FUNCTION "audit_events_refuse_change"() RETURNS trigger AS $$
BEGIN
  RAISE EXCEPTION 'audit_events is append-only: % refused', TG_OP USING ERRCODE = 'insufficient_privilege';
END
$$ LANGUAGE plpgsql;
--> statement-breakpoint
CREATE TRIGGER "audit_events_no_update_delete" BEFORE UPDATE OR DELETE ON "audit_events"
  FOR EACH ROW EXECUTE FUNCTION "audit_events_refuse_change"();
--> statement-breakpoint
CREATE TRIGGER "audit_events_no_truncate" BEFORE TRUNCATE ON "audit_events"
  FOR EACH STATEMENT EXECUTE FUNCTION "audit_events_refuse_change"();
--> statement-breakpoint
-- Rate-limit counters shared by every API instance (server/middleware/rate-limit-store.ts).
-- UNLOGGED: no write-ahead log, so a counter update costs little; after a crash PostgreSQL
-- empties the table, which only forgives some recent attempts.
CREATE UNLOGGED TABLE IF NOT EXISTS "rate_limit_counters" (
  "key" varchar(255) PRIMARY KEY,
  "points" integer NOT NULL DEFAULT 0,
  "expire" bigint
);
--> statement-breakpoint
-- Viewers see coarse device classes only: earlier raw user-agent strings become a class.
UPDATE "respondents" SET "device" = CASE
    WHEN "device" ~* 'ipad|tablet|kindle|silk|playbook' OR ("device" ~* 'android' AND "device" !~* 'mobi') THEN 'tablet'
    WHEN "device" ~* 'mobi|iphone|ipod|android|phone' THEN 'phone'
    WHEN "device" ~* 'windows|macintosh|mac os x|linux|cros|x11|desktop' THEN 'desktop'
    ELSE 'unknown'
  END
  WHERE "device" NOT IN ('phone', 'tablet', 'desktop', 'unknown');
