/**
 * The mail outbox: every invitation and reminder to a study's invitees is written here in
 * the same transaction as the invitee's state change and the queue job that will send it.
 * Workers send it, retry with backoff while the mail server is unreachable, and record the
 * outcome; a row is never sent twice (server/services/mail-delivery.ts).
 */
import { index, integer, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { teams } from './accounts';
import { studies } from './studies';
import { invitees } from './fieldwork';

export const mailOutbox = pgTable(
  'mail_outbox',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    studyId: uuid('study_id').references(() => studies.id, { onDelete: 'cascade' }),
    inviteeId: uuid('invitee_id').references(() => invitees.id, { onDelete: 'cascade' }),
    /** invitation | reminder */
    kind: text('kind').notNull(),
    toAddress: text('to_address').notNull(),
    subject: text('subject').notNull(),
    textBody: text('text_body').notNull(),
    htmlBody: text('html_body'),
    headers: jsonb('headers').notNull().default({}),
    /** queued → sending → sent | failed (back to queued while the mail server is unreachable). */
    status: text('status').notNull().default('queued'),
    attempts: integer('attempts').notNull().default(0),
    /** Why the last attempt failed, in words a researcher can act on. */
    lastError: text('last_error'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    sendingAt: timestamp('sending_at', { withTimezone: true }),
    sentAt: timestamp('sent_at', { withTimezone: true }),
    failedAt: timestamp('failed_at', { withTimezone: true }),
  },
  (t) => [
    index('mail_outbox_invitee_idx').on(t.inviteeId, t.createdAt),
    index('mail_outbox_status_idx').on(t.status, t.createdAt),
  ],
);
