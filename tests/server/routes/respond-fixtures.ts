/**
 * A small Larkspur Valley Water study for fieldwork tests: two unlabeled packages plus the
 * status quo, a 2-block design of 2 tasks each, and a questionnaire with every page kind.
 */
import { nanoid } from 'nanoid';
import { invitees } from '../../../db/schema/fieldwork';
import { expect } from 'vitest';
import type { FileTestApp, TestApp } from '../../support/test-app';
import { makeStudyDefinition } from '../../../scripts/lib/study-factory/definition';
import { insertStudyRow } from '../../../scripts/lib/study-factory/insert-study';
import type { Design } from '../../../shared/schemas/design';
import type { Questionnaire } from '../../../shared/schemas/questionnaire';
import { createPage, demoQuestionnaire } from '../../../shared/schemas/questionnaire-defaults';
import type { AnswerValue, SubmitAnswerInput } from '../../../shared/schemas/respondent';

export const definition = makeStudyDefinition();

const alt = (bill: string, interrupt: string, warn: string, river: string, renew: string) => ({
  levels: { bill, interrupt, warn, river, renew },
});

export const design: Design = {
  blocks: 2,
  tasks: [
    {
      block: 1,
      task: 1,
      alternatives: [alt('b3', 'i2', 'w2', 'fair', 'r50'), alt('b10', 'i1', 'w0', 'good', 'r80')],
    },
    {
      block: 1,
      task: 2,
      alternatives: [alt('b6', 'i1', 'w6', 'good', 'r20'), alt('b15', 'i2', 'w0', 'fair', 'r50')],
    },
    {
      block: 2,
      task: 3,
      alternatives: [alt('b0', 'i2', 'w0', 'poor', 'r80'), alt('b6', 'i4', 'w2', 'good', 'r50')],
    },
    {
      block: 2,
      task: 4,
      alternatives: [alt('b10', 'i4', 'w0', 'fair', 'r20'), alt('b3', 'i1', 'w6', 'poor', 'r80')],
    },
  ],
};

/** Demo questionnaire with a screening question (age ≥ 18) first after consent. */
export function fullQuestionnaire(): Questionnaire {
  const q = demoQuestionnaire(definition);
  const [consent, ...rest] = q.pages;
  const screening = createPage('screening', definition);
  if (screening.kind !== 'screening') throw new Error('createPage made no screening page');
  // Some tests send respondents back to a panel with their id: the consent says so.
  const body = `${consent.kind === 'consent' ? consent.body : ''}\n\nIf you came from a survey panel, your answers are linked to your panel id.`;
  return {
    ...q,
    pages: [
      { ...consent, body } as typeof consent,
      // The editor's new screening page (18 or older, "no" screens out) under an id and key
      // the tests name.
      { ...screening, id: 'adult', question: { ...screening.question, key: 'adult' } },
      ...rest,
    ],
  };
}

/** A draft with the hand-made design above as its current design (go live in the test). */
export async function insertStudy(
  t: TestApp,
  teamId: string,
  opts: { questionnaire?: Questionnaire | null; withDesign?: boolean; settings?: unknown } = {},
) {
  const study = await insertStudyRow(t.deps.db, {
    teamId,
    // Respondents see the public title, never the internal name.
    name: 'Water pilot W-26 (internal)',
    publicTitle: 'Water services 2026',
    definition,
    design: opts.withDesign === false ? null : design,
    questionnaire: opts.questionnaire === null ? {} : (opts.questionnaire ?? fullQuestionnaire()),
    settings: opts.settings,
  });
  return { id: study.studyId, publicId: study.publicId };
}

/**
 * Saves `questionnaire` on a new study as its owner and expects a 400 that changes nothing (the
 * stored questionnaire reads as before); gives the refusal, for its error to be checked.
 */
export async function expectQuestionnaireRefused(t: FileTestApp<'owner'>, questionnaire: unknown) {
  const study = await insertStudy(t, t.teamId);
  const url = `/api/teams/${t.teamId}/studies/${study.id}/questionnaire`;
  const before = (await t.owner.get(url).expect(200)).body;
  const res = await t.owner.put(url).send({ questionnaire }).expect(400);
  expect((await t.owner.get(url).expect(200)).body).toEqual(before);
  return res;
}

export async function insertInvitee(t: TestApp, studyId: string, externalId: string | null = null) {
  const [row] = await t.deps.db
    .insert(invitees)
    .values({ studyId, email: `${nanoid(6)}@example.test`, token: nanoid(32), externalId })
    .returning({ id: invitees.id, token: invitees.token });
  return row;
}

type Screen = {
  key: string;
  kind: string;
  question?: { type: string; key: string; options?: { id: string }[]; min?: number };
  alternatives?: unknown[];
  certainty?: { points: number };
};

/** A plausible answer for any screen (first option, the minimum, the first card). */
export function answerFor(
  screen: Screen,
  overrides: Partial<SubmitAnswerInput> = {},
): SubmitAnswerInput {
  const value = ((): AnswerValue => {
    if (screen.kind === 'consent') return { kind: 'consent', agreed: true };
    if (screen.kind === 'instructions') return { kind: 'ack' };
    if (screen.kind === 'task')
      return { kind: 'choice', position: 0, ...(screen.certainty ? { certainty: 1 } : {}) };
    const q = screen.question!;
    if (q.type === 'single') return { kind: 'single', optionId: q.options![0].id };
    if (q.type === 'multiple') return { kind: 'multiple', optionIds: [q.options![0].id] };
    if (q.type === 'number') return { kind: 'number', number: q.min! };
    return { kind: 'text', text: 'fine' };
  })();
  return {
    clientId: crypto.randomUUID(),
    screenKey: screen.key,
    value,
    responseMs: 1500,
    ...overrides,
  };
}

export type LiveScreen = Screen & { screening?: boolean };
export type LiveSession = {
  sessionToken: string;
  screens: LiveScreen[];
  given: Record<string, unknown>;
};

/** A live study with this questionnaire (go-live by its owner) and one respondent's session. */
export async function startLiveSession(
  t: TestApp,
  owner: { post: (url: string) => { expect: (status: number) => Promise<unknown> } },
  teamId: string,
  questionnaire: Questionnaire = fullQuestionnaire(),
) {
  const study = await insertStudy(t, teamId, { questionnaire });
  await owner.post(`/api/teams/${teamId}/studies/${study.id}/lifecycle/go-live`).expect(200);
  const res = await t.request().post(`/api/r/${study.publicId}/sessions`).send({}).expect(201);
  return { study, session: res.body as LiveSession };
}

/** Sends an answer, or a changed one (`revisions`), with the respondent's session token. */
export const sendAnswer = (
  t: TestApp,
  publicId: string,
  token: string,
  path: 'answers' | 'revisions',
  body: object,
) => t.request().post(`/api/r/${publicId}/${path}`).set('x-respondent-token', token).send(body);

/** One respondent of a live study: starts a session and answers every screen. */
export async function completeRespondent(t: TestApp, publicId: string): Promise<LiveSession> {
  const res = await t.request().post(`/api/r/${publicId}/sessions`).send({}).expect(201);
  const session = res.body as LiveSession;
  for (const screen of session.screens)
    await sendAnswer(t, publicId, session.sessionToken, 'answers', answerFor(screen)).expect(201);
  return session;
}
