/** Saved what-if scenarios of the Shares section, named per study. */
import {
  boolean,
  index,
  jsonb,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from 'drizzle-orm/pg-core';
import { teams, users } from './accounts';
import { studies } from './studies';

export const shareScenarios = pgTable(
  'share_scenarios',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    teamId: uuid('team_id')
      .notNull()
      .references(() => teams.id, { onDelete: 'cascade' }),
    studyId: uuid('study_id')
      .notNull()
      .references(() => studies.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    /** ScenarioAlternative[] (shared/schemas/shares.ts), checked against the study on save. */
    alternatives: jsonb('alternatives').notNull(),
    includeFixed: boolean('include_fixed').notNull().default(true),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('share_scenarios_team_idx').on(t.teamId),
    uniqueIndex('share_scenarios_study_name_idx').on(t.studyId, t.name),
  ],
);
