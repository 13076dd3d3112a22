/**
 * Fieldwork: invitees with personal links, respondents (one per answering session) and their
 * answers. An answer is keyed by (respondent, screen) and carries the client-made id, so a retry
 * or a duplicate submission never creates a second row.
 */
import {
  boolean,
  index,
  integer,
  jsonb,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { respondentStatusEnum } from './enums';
import { studies, studyVersions } from './studies';

export const invitees = pgTable(
  'invitees',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    studyId: uuid('study_id')
      .notNull()
      .references(() => studies.id, { onDelete: 'cascade' }),
    email: text('email').notNull(),
    name: text('name').notNull().default(''),
    externalId: text('external_id'),
    /** Unguessable token in the personal link. */
    token: text('token').notNull(),
    invitedAt: timestamp('invited_at', { withTimezone: true }),
    lastRemindedAt: timestamp('last_reminded_at', { withTimezone: true }),
    reminderCount: integer('reminder_count').notNull().default(0),
    unsubscribedAt: timestamp('unsubscribed_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('invitees_token_uq').on(t.token),
    uniqueIndex('invitees_study_email_uq').on(t.studyId, t.email),
  ],
);

export const respondents = pgTable(
  'respondents',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    studyId: uuid('study_id')
      .notNull()
      .references(() => studies.id, { onDelete: 'cascade' }),
    versionId: uuid('version_id')
      .notNull()
      .references(() => studyVersions.id, { onDelete: 'restrict' }),
    /** Secret session token held by the respondent's browser; it reaches only this row. */
    sessionToken: text('session_token').notNull(),
    inviteeId: uuid('invitee_id').references(() => invitees.id, { onDelete: 'set null' }),
    externalId: text('external_id'),
    /**
     * The panel id that de-duplicates this respondent within the study (set only when the
     * study de-duplicates panel ids and the link carried one): a returning id resumes its own
     * session instead of making a second respondent.
     */
    panelKey: text('panel_key'),
    block: integer('block').notNull(),
    /** Per-respondent randomisation: task order and alternative positions, stored. */
    plan: jsonb('plan').notNull(),
    status: respondentStatusEnum('status').notNull().default('in_progress'),
    startedAt: timestamp('started_at', { withTimezone: true }).notNull().defaultNow(),
    finishedAt: timestamp('finished_at', { withTimezone: true }),
    durationMs: integer('duration_ms'),
    device: text('device').notNull().default(''),
    /** The language the respondent answers in (one of their version's languages). */
    language: text('language').notNull().default('en'),
    /** Automatic quality flags (speeder, same position, dominance failure, inconsistency). */
    flags: jsonb('flags').notNull().default({}),
    included: boolean('included').notNull().default(true),
    exclusionReason: text('exclusion_reason'),
    /** Set for synthetic demo respondents: their true simulated coefficients. */
    simulatedTruth: jsonb('simulated_truth'),
  },
  (t) => [
    uniqueIndex('respondents_session_token_uq').on(t.sessionToken),
    index('respondents_study_idx').on(t.studyId, t.status),
    // One personal link, one respondent, even when it is opened on two devices at once.
    uniqueIndex('respondents_invitee_uq').on(t.inviteeId),
    uniqueIndex('respondents_study_panel_key_uq').on(t.studyId, t.panelKey),
  ],
);

export const answers = pgTable(
  'answers',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    respondentId: uuid('respondent_id')
      .notNull()
      .references(() => respondents.id, { onDelete: 'cascade' }),
    studyId: uuid('study_id')
      .notNull()
      .references(() => studies.id, { onDelete: 'cascade' }),
    /** Client-made id (idempotency key). */
    clientId: text('client_id').notNull(),
    /** Screen key from the questionnaire, e.g. "task:3", "q:household_size", "consent". */
    screenKey: text('screen_key').notNull(),
    /** Choice tasks: design task number and the chosen alternative (design index; -1 = fixed alternative). */
    taskNumber: integer('task_number'),
    chosenAlternative: integer('chosen_alternative'),
    /** Position on screen the chosen card had (0-based), for position-bias checks. */
    chosenPosition: integer('chosen_position'),
    value: jsonb('value'),
    responseMs: integer('response_ms'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    /** How often the respondent went back and changed this answer; earlier ones are in answer_revisions. */
    revisionCount: integer('revision_count').notNull().default(0),
    revisedAt: timestamp('revised_at', { withTimezone: true }),
  },
  (t) => [
    uniqueIndex('answers_respondent_screen_uq').on(t.respondentId, t.screenKey),
    uniqueIndex('answers_respondent_client_uq').on(t.respondentId, t.clientId),
    index('answers_study_idx').on(t.studyId),
  ],
);

/**
 * How many respondents of each block of a version still count toward filling it (in progress
 * or completed): filling[b - 1] for block b. One row per version is one atomic counter:
 * session start takes the least-filled block in a single UPDATE of this row (its lock lasts
 * that statement), instead of counting respondents under a study-wide lock; a respondent who
 * is screened out or over quota gives the place back.
 */
export const respondentBlockCounts = pgTable('respondent_block_counts', {
  versionId: uuid('version_id')
    .primaryKey()
    .references(() => studyVersions.id, { onDelete: 'cascade' }),
  filling: integer('filling').array().notNull(),
  /** The block the latest assignment took (read back by that UPDATE's RETURNING). */
  lastBlock: integer('last_block').notNull().default(0),
});

/**
 * Answers a respondent replaced by going back: the row as it was before each change, with when
 * it was given and when it was replaced. The current answer stays in `answers`.
 */
export const answerRevisions = pgTable(
  'answer_revisions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    answerId: uuid('answer_id')
      .notNull()
      .references(() => answers.id, { onDelete: 'cascade' }),
    respondentId: uuid('respondent_id')
      .notNull()
      .references(() => respondents.id, { onDelete: 'cascade' }),
    studyId: uuid('study_id')
      .notNull()
      .references(() => studies.id, { onDelete: 'cascade' }),
    screenKey: text('screen_key').notNull(),
    clientId: text('client_id').notNull(),
    taskNumber: integer('task_number'),
    chosenAlternative: integer('chosen_alternative'),
    chosenPosition: integer('chosen_position'),
    value: jsonb('value'),
    responseMs: integer('response_ms'),
    answeredAt: timestamp('answered_at', { withTimezone: true }).notNull(),
    replacedAt: timestamp('replaced_at', { withTimezone: true }).notNull(),
  },
  (t) => [
    uniqueIndex('answer_revisions_respondent_client_uq').on(t.respondentId, t.clientId),
    index('answer_revisions_study_idx').on(t.studyId),
  ],
);

/**
 * What is left of a respondent erased on request: only the id and start time their row had,
 * so that the respondent numbers of everyone else (order of starting, ties by id) stay as they
 * were. No answer, personal field or device survives; the respondents row itself is deleted.
 */
export const respondentTombstones = pgTable(
  'respondent_tombstones',
  {
    /** The erased respondent's random id (not personal data; nothing refers to it any more). */
    id: uuid('id').primaryKey(),
    studyId: uuid('study_id')
      .notNull()
      .references(() => studies.id, { onDelete: 'cascade' }),
    startedAt: timestamp('started_at', { withTimezone: true }).notNull(),
    erasedAt: timestamp('erased_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('respondent_tombstones_study_idx').on(t.studyId, t.startedAt)],
);
