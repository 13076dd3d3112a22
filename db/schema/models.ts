/**
 * Estimation runs, the last checkpoint of a running one, each respondent's taste profile from a
 * run, and saved respondent filters.
 */
import {
  doublePrecision,
  index,
  integer,
  jsonb,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uuid,
} from 'drizzle-orm/pg-core';
import { jobStatusEnum } from './enums';
import { teams, users } from './accounts';
import { studies } from './studies';
import { respondents } from './fieldwork';

export const runs = pgTable(
  'runs',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    studyId: uuid('study_id')
      .notNull()
      .references(() => studies.id, { onDelete: 'cascade' }),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    name: text('name').notNull().default(''),
    /** mnl | mixed */
    model: text('model').notNull(),
    spec: jsonb('spec').notNull(),
    /** SHA-256 of the choice data the run used. */
    dataHash: text('data_hash'),
    seed: doublePrecision('seed'),
    status: jobStatusEnum('status').notNull().default('queued'),
    progress: jsonb('progress').notNull().default({}),
    results: jsonb('results'),
    error: text('error'),
    attempts: doublePrecision('attempts').notNull().default(0),
    cancelRequested: timestamp('cancel_requested', { withTimezone: true }),
    /** Respondents whose data this run used and who have since been erased on request. */
    erasedRespondents: integer('erased_respondents').notNull().default(0),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    startedAt: timestamp('started_at', { withTimezone: true }),
    finishedAt: timestamp('finished_at', { withTimezone: true }),
  },
  (t) => [index('runs_study_idx').on(t.studyId)],
);

/**
 * Where a running mixed logit's optimisation stood when last saved (at most every few seconds),
 * so that a run whose worker was lost goes on from there (server/jobs/run-checkpoints.ts).
 * Deleted when the run ends.
 */
export const runCheckpoints = pgTable('run_checkpoints', {
  runId: uuid('run_id')
    .primaryKey()
    .references(() => runs.id, { onDelete: 'cascade' }),
  /** The claim (runs.attempts) that saved it. */
  attempt: integer('attempt').notNull(),
  /** SHA-256 of the choice data it was estimated on: other data cannot resume from it. */
  dataHash: text('data_hash').notNull(),
  /** Iterations over all starts, and the current start (1-based). */
  iteration: integer('iteration').notNull(),
  start: integer('start').notNull(),
  /** The engine's checkpoint, vectors as base64 of their float64 bytes (exact). */
  state: jsonb('state').notNull(),
  savedAt: timestamp('saved_at', { withTimezone: true }).notNull().defaultNow(),
});

export const tasteProfiles = pgTable(
  'taste_profiles',
  {
    runId: uuid('run_id')
      .notNull()
      .references(() => runs.id, { onDelete: 'cascade' }),
    respondentId: uuid('respondent_id')
      .notNull()
      .references(() => respondents.id, { onDelete: 'cascade' }),
    mean: jsonb('mean').notNull(),
    sd: jsonb('sd').notNull(),
    wtp: jsonb('wtp'),
    /** HB intervals and WTP spread, latent class probabilities (shared tasteProfileSchema). */
    extra: jsonb('extra'),
    effectiveDraws: doublePrecision('effective_draws').notNull(),
  },
  (t) => [primaryKey({ name: 'taste_profiles_pk', columns: [t.runId, t.respondentId] })],
);

export const respondentFilters = pgTable(
  'respondent_filters',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    studyId: uuid('study_id')
      .notNull()
      .references(() => studies.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    definition: jsonb('definition').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('respondent_filters_study_idx').on(t.studyId)],
);
