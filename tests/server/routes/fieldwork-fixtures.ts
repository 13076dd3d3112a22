/**
 * Arrange helpers for the fieldwork, invitee and response API tests: a study with a frozen
 * version, and respondents with answers written straight into the tables (the respondent flow
 * itself is tested by its own API tests).
 */
import { eq } from 'drizzle-orm';
import type { Db } from '../../../db/client';
import { invitees } from '../../../db/schema/fieldwork';
import { makeStudyDefinition } from '../../../scripts/lib/study-factory/definition';
import { makeStudyDesign } from '../../../scripts/lib/study-factory/design';
import {
  insertStudyRow,
  insertStudyVersion,
} from '../../../scripts/lib/study-factory/insert-study';
import { insertRespondentRow } from '../../../scripts/lib/study-factory/insert-respondent';

/** A questionnaire with every screen kind the fieldwork figures know about. */
export const fixtureQuestionnaire = {
  pages: [
    {
      id: 'consent1',
      kind: 'consent',
      title: 'Welcome',
      body: 'Consent text',
      agreeLabel: 'I agree',
    },
    {
      id: 'hh1',
      kind: 'question',
      question: {
        key: 'household_size',
        text: 'How many people live in your household?',
        type: 'number',
        min: 1,
        max: 12,
      },
    },
    { id: 'intro1', kind: 'instructions', title: 'How the choices work', body: 'Pick one.' },
    { id: 'tasks1', kind: 'tasks', title: 'Choices' },
    { id: 'dom1', kind: 'dominance', title: 'One more', bestLevels: {} },
    { id: 'rep1', kind: 'repeat', title: 'Once more', repeatOf: 2 },
    { id: 'end1', kind: 'end', title: 'Thank you', body: '' },
  ],
};

/** Two blocks of eight tasks (only the block structure matters to the figures). */
export const fixtureDesign = makeStudyDesign(makeStudyDefinition());

/** Live by default, with version 1 frozen (also for a draft: a study set back after fieldwork). */
/** The answerable screens of the fixture questionnaire and design, in the order shown. */
export const fixtureScreenKeys = [
  'consent',
  'q:household_size',
  'page:intro1',
  ...Array.from({ length: 8 }, (_, i) => `tasks#${i + 1}`),
  'dominance:dom1',
  'repeat:rep1',
];

export async function insertStudy(
  db: Db,
  p: {
    teamId: string;
    status?: 'draft' | 'live' | 'closed';
    name?: string;
    settings?: object;
    definition?: object;
  },
) {
  const study = await insertStudyRow(db, {
    status: 'live',
    definition: {},
    ...p,
    frozen: true,
    design: fixtureDesign,
    questionnaire: fixtureQuestionnaire,
  });
  return { studyId: study.studyId, publicId: study.publicId, versionId: study.versionId! };
}

export const addVersion = (db: Db, studyId: string, version: number) =>
  insertStudyVersion(db, {
    studyId,
    version,
    definition: {},
    design: fixtureDesign,
    questionnaire: fixtureQuestionnaire,
  });

export type ChoiceFixture = {
  screenKey: string;
  taskNumber: number;
  chosenAlternative: number;
  chosenPosition: number;
};

/** A respondent who started an hour ago, answering every 10 s, done after 10 minutes by default. */
export async function insertRespondent(
  db: Db,
  p: {
    studyId: string;
    versionId: string;
    status?: 'in_progress' | 'completed' | 'screened_out' | 'over_quota';
    block?: number;
    durationMs?: number | null;
    inviteeId?: string | null;
    externalId?: string | null;
    choices?: ChoiceFixture[];
    other?: Array<{ screenKey: string; value: unknown }>;
    special?: Array<{ screenKey: string; chosenAlternative: number; value: object }>;
  },
) {
  const { choices = [], other = [], special = [], ...respondent } = p;
  const startedAt = new Date(Date.now() - 3_600_000);
  const rows = [
    ...other.map((o) => ({ screenKey: o.screenKey, value: o.value })),
    ...choices.map((c) => ({
      ...c,
      value: { kind: 'choice', position: c.chosenPosition, taskKind: 'design' },
    })),
    ...special.map((c) => ({
      screenKey: c.screenKey,
      chosenAlternative: c.chosenAlternative,
      chosenPosition: 0,
      value: { kind: 'choice', position: 0, ...c.value },
    })),
  ];
  return insertRespondentRow(db, {
    durationMs: 600_000,
    ...respondent,
    startedAt,
    answers: rows.map((a, i) => ({
      ...a,
      responseMs: 5000,
      createdAt: new Date(startedAt.getTime() + (i + 1) * 10_000),
    })),
  });
}

/** Eight design tasks; `position` picks the on-screen position, alternative = position here. */
export function eightChoices(position: (t: number) => number): ChoiceFixture[] {
  return Array.from({ length: 8 }, (_, i) => ({
    screenKey: `task:${i + 1}`,
    taskNumber: i + 1,
    chosenAlternative: position(i + 1),
    chosenPosition: position(i + 1),
  }));
}

export async function getInviteeRow(db: Db, email: string) {
  const [row] = await db.select().from(invitees).where(eq(invitees.email, email));
  return row ?? null;
}
