/**
 * Studies and what belongs to their definition: the attribute/level document, designs,
 * design-generation jobs, the questionnaire, and the frozen versions taken at go-live.
 * Documents (definition, design, questionnaire, settings) are JSON validated by the zod
 * schemas in shared/schemas before they are written.
 */
import {
  index,
  integer,
  jsonb,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { jobStatusEnum, studyStatusEnum } from './enums';
import { teams, users } from './accounts';

export const studies = pgTable(
  'studies',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    /** Unguessable id used in the public respondent link. */
    publicId: text('public_id').notNull(),
    name: text('name').notNull(),
    /** What respondents see (survey pages, invitation e-mails); the name stays internal. */
    publicTitle: text('public_title').notNull().default(''),
    description: text('description').notNull().default(''),
    status: studyStatusEnum('status').notNull().default('draft'),
    /** 'fielded': answered through Choicewright; 'imported': created from a choice file. */
    source: text('source').$type<'fielded' | 'imported'>().notNull().default('fielded'),
    definition: jsonb('definition').notNull(),
    questionnaire: jsonb('questionnaire').notNull().default({}),
    /** Fieldwork settings: close date, quota, redirects, quality thresholds. */
    settings: jsonb('settings').notNull().default({}),
    /** BCP 47 tags; the first is the source language the documents are written in. */
    languages: jsonb('languages').$type<string[]>().notNull().default(['en']),
    /** language -> text key -> text (shared/languages/study-text-keys.ts names the keys). */
    translations: jsonb('translations')
      .$type<Record<string, Record<string, string>>>()
      .notNull()
      .default({}),
    /**
     * language -> text key -> the source wording a translation was made from (recorded when it
     * is saved, imported or confirmed): a translation whose source has changed since is stale.
     */
    translationSources: jsonb('translation_sources')
      .$type<Record<string, Record<string, string>>>()
      .notNull()
      .default({}),
    /** The design currently attached to the study (designs.id). */
    currentDesignId: uuid('current_design_id'),
    /** Latest frozen version number (0 = never live). */
    currentVersion: integer('current_version').notNull().default(0),
    archivedAt: timestamp('archived_at', { withTimezone: true }),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('studies_public_id_uq').on(t.publicId),
    index('studies_team_idx').on(t.teamId),
  ],
);

export const designs = pgTable(
  'designs',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    studyId: uuid('study_id')
      .notNull()
      .references(() => studies.id, { onDelete: 'cascade' }),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    /** full_factorial | random | d_efficient | imported */
    method: text('method').notNull(),
    spec: jsonb('spec').notNull().default({}),
    design: jsonb('design').notNull(),
    diagnostics: jsonb('diagnostics').notNull().default({}),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('designs_study_idx').on(t.studyId)],
);

/** A design-generation job run off the request path (worker), with progress and cancel. */
export const designJobs = pgTable(
  'design_jobs',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    studyId: uuid('study_id')
      .notNull()
      .references(() => studies.id, { onDelete: 'cascade' }),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    spec: jsonb('spec').notNull(),
    /**
     * 'attach': the design becomes the study's current one (drafts only). 'candidate': it is
     * kept beside the current one for comparison until adopted or discarded (any status).
     */
    purpose: text('purpose').notNull().default('attach'),
    status: jobStatusEnum('status').notNull().default('queued'),
    progress: jsonb('progress').notNull().default({}),
    designId: uuid('design_id').references(() => designs.id, { onDelete: 'set null' }),
    error: text('error'),
    cancelRequested: timestamp('cancel_requested', { withTimezone: true }),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    startedAt: timestamp('started_at', { withTimezone: true }),
    finishedAt: timestamp('finished_at', { withTimezone: true }),
  },
  (t) => [index('design_jobs_study_idx').on(t.studyId)],
);

/** Frozen copy of definition, design and questionnaire taken each time a study goes live. */
export const studyVersions = pgTable(
  'study_versions',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    studyId: uuid('study_id')
      .notNull()
      .references(() => studies.id, { onDelete: 'cascade' }),
    version: integer('version').notNull(),
    definition: jsonb('definition').notNull(),
    design: jsonb('design').notNull(),
    questionnaire: jsonb('questionnaire').notNull(),
    /** The languages and translations frozen with the questionnaire. */
    languages: jsonb('languages').$type<string[]>().notNull().default(['en']),
    translations: jsonb('translations')
      .$type<Record<string, Record<string, string>>>()
      .notNull()
      .default({}),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('study_versions_study_version_uq').on(t.studyId, t.version)],
);

/** Uploaded files (level images); the bytes live in the storage module, not here. */
export const storedFiles = pgTable(
  'stored_files',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    studyId: uuid('study_id').references(() => studies.id, { onDelete: 'cascade' }),
    storageKey: text('storage_key').notNull(),
    contentType: text('content_type').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
    originalName: text('original_name').notNull().default(''),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex('stored_files_key_uq').on(t.storageKey)],
);
