/**
 * The audit trail: who did what and when. Append-only — a trigger (migration
 * 0003_append_only_audit_and_counters) refuses UPDATE, DELETE and TRUNCATE, and no query in db/queries
 * writes anything but INSERT. No foreign keys on purpose: a row outlives the user, study or
 * respondent it names (and a cascading delete would be an UPDATE/DELETE the trigger refuses).
 * Rows name people by id and e-mail of the acting team member only; respondents by number.
 */
import { bigserial, index, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';

export const auditEvents = pgTable(
  'audit_events',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
    /** Null for events outside a team (sign-ins): they are shown to the teams of the actor. */
    teamId: uuid('team_id'),
    actorId: uuid('actor_id'),
    actorEmail: text('actor_email'),
    /** e.g. auth.sign_in, member.role_changed, study.live, run.started, respondent.erased */
    action: text('action').notNull(),
    studyId: uuid('study_id'),
    targetType: text('target_type'),
    targetId: text('target_id'),
    details: jsonb('details').notNull().default({}),
  },
  (t) => [
    index('audit_events_team_at_idx').on(t.teamId, t.at),
    index('audit_events_actor_at_idx').on(t.actorId, t.at),
  ],
);
