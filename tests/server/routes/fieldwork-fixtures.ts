/**
 * Arrange helpers for the fieldwork, invitee and response API tests: a study with a frozen
 * version, and respondents with answers written straight into the tables (the respondent flow
 * itself is tested by its own API tests).
 */
import { randomBytes } from 'node:crypto';
import { nanoid } from 'nanoid';
import { eq } from 'drizzle-orm';
import type { Db } from '../../../db/client';
import { studies, studyVersions } from '../../../db/schema/studies';
import { answers, invitees, respondents } from '../../../db/schema/fieldwork';

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
export const fixtureDesign = {
  blocks: 2,
  tasks: Array.from({ length: 16 }, (_, i) => ({
    block: i < 8 ? 1 : 2,
    task: i + 1,
    alternatives: [{ levels: {} }, { levels: {} }],
  })),
};

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
  const [study] = await db
    .insert(studies)
    .values({
      teamId: p.teamId,
      publicId: nanoid(12),
      name: p.name ?? 'Larkspur service packages',
      status: p.status ?? 'live',
      definition: p.definition ?? {},
      settings: p.settings ?? {},
      currentVersion: 1,
    })
    .returning({ id: studies.id, publicId: studies.publicId });
  const [version] = await db
    .insert(studyVersions)
    .values({
      studyId: study.id,
      version: 1,
      definition: p.definition ?? {},
      design: fixtureDesign,
      questionnaire: fixtureQuestionnaire,
    })
    .returning({ id: studyVersions.id });
  return { studyId: study.id, publicId: study.publicId, versionId: version.id };
}

export async function addVersion(db: Db, studyId: string, version: number) {
  const [v] = await db
    .insert(studyVersions)
    .values({
      studyId,
      version,
      definition: {},
      design: fixtureDesign,
      questionnaire: fixtureQuestionnaire,
    })
    .returning({ id: studyVersions.id });
  await db.update(studies).set({ currentVersion: version }).where(eq(studies.id, studyId));
  return v.id;
}

export type ChoiceFixture = {
  screenKey: string;
  taskNumber: number;
  chosenAlternative: number;
  chosenPosition: number;
};

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
  const status = p.status ?? 'completed';
  const started = new Date(Date.now() - 3_600_000);
  const durationMs = p.durationMs === undefined ? 600_000 : p.durationMs;
  const [r] = await db
    .insert(respondents)
    .values({
      studyId: p.studyId,
      versionId: p.versionId,
      sessionToken: randomBytes(24).toString('base64url'),
      inviteeId: p.inviteeId ?? null,
      externalId: p.externalId ?? null,
      block: p.block ?? 1,
      plan: {},
      status,
      startedAt: started,
      finishedAt:
        status === 'in_progress' || durationMs === null
          ? null
          : new Date(started.getTime() + durationMs),
      durationMs: status === 'in_progress' ? null : durationMs,
    })
    .returning({ id: respondents.id });
  const rows = [
    ...(p.other ?? []).map((o) => ({ screenKey: o.screenKey, value: o.value })),
    ...(p.choices ?? []).map((c) => ({
      screenKey: c.screenKey,
      taskNumber: c.taskNumber,
      chosenAlternative: c.chosenAlternative,
      chosenPosition: c.chosenPosition,
      value: { kind: 'choice', position: c.chosenPosition, taskKind: 'design' },
    })),
    ...(p.special ?? []).map((c) => ({
      screenKey: c.screenKey,
      chosenAlternative: c.chosenAlternative,
      chosenPosition: 0,
      value: { kind: 'choice', position: 0, ...c.value },
    })),
  ].map((a, i) => ({
    ...a,
    respondentId: r.id,
    studyId: p.studyId,
    clientId: `fixture-${nanoid(10)}`,
    responseMs: 5000,
    createdAt: new Date(started.getTime() + (i + 1) * 10_000),
  }));
  if (rows.length > 0) await db.insert(answers).values(rows);
  return r.id;
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
