/**
 * Sets up a live Larkspur Valley Water study through the API as the demo editor, so the
 * respondent journey does not depend on the state of the seeded demo study.
 */
import { demoCredential } from './demo-credentials';
import { expect, type APIRequestContext } from '@playwright/test';
import { demoQuestionnaire } from '../../shared/schemas/questionnaire-defaults';
import type { Questionnaire } from '../../shared/schemas/questionnaire';
import type { StudyDefinition } from '../../shared/schemas/study-definition';

const levels = (prefix: string, values: number[], unit = '') =>
  values.map((v) => ({
    id: `${prefix}${v}`,
    label: `${unit === '€' ? '€' : ''}${v}${unit && unit !== '€' ? ` ${unit}` : ''}`,
    value: v,
  }));

export const larkspurDefinition: StudyDefinition = {
  attributes: [
    {
      id: 'bill',
      name: 'Monthly bill increase',
      kind: 'numeric',
      unit: '€',
      isCost: true,
      coding: 'linear',
      levels: levels('b', [0, 3, 6, 10, 15], '€'),
    },
    {
      id: 'interrupt',
      name: 'Supply interruptions per year',
      kind: 'numeric',
      isCost: false,
      coding: 'linear',
      levels: levels('i', [4, 2, 1]),
    },
    {
      id: 'warn',
      name: 'Days of taste or odour warnings per year',
      kind: 'numeric',
      isCost: false,
      coding: 'linear',
      levels: levels('w', [6, 2, 0]),
    },
    {
      id: 'river',
      name: 'River health rating',
      kind: 'categorical',
      isCost: false,
      coding: 'dummy',
      levels: [
        { id: 'poor', label: 'Poor' },
        { id: 'fair', label: 'Fair' },
        { id: 'good', label: 'Good' },
      ],
    },
    {
      id: 'renew',
      name: 'Renewable pumping energy',
      kind: 'numeric',
      unit: '%',
      isCost: false,
      coding: 'linear',
      levels: levels('r', [20, 50, 80], '%'),
    },
  ],
  alternatives: { count: 2, labeled: false, labels: [] },
  fixedAlternative: {
    kind: 'status_quo',
    label: 'Current service',
    levels: { bill: 'b0', interrupt: 'i4', warn: 'w6', river: 'poor', renew: 'r20' },
  },
  excludedCombinations: [],
};

export function demoEditor(): { email: string; password: string } {
  return demoCredential('editor');
}

/** Signs in as the demo editor on `api` and returns the team id. */
export async function signInEditor(api: APIRequestContext): Promise<string> {
  const signIn = await api.post('/api/auth/sign-in', { data: demoEditor() });
  expect(signIn.status()).toBe(200);
  const me = await (await api.get('/api/auth/me')).json();
  return me.teams[0].id as string;
}

/**
 * A new live study: definition (Larkspur by default), a random 2-block design of 8 tasks, and
 * the demo questionnaire unless another one is given.
 */
export async function createLiveStudy(
  api: APIRequestContext,
  name: string,
  options: { definition?: StudyDefinition; questionnaire?: Questionnaire } = {},
) {
  const definition = options.definition ?? larkspurDefinition;
  const questionnaire = options.questionnaire ?? demoQuestionnaire(definition);
  const teamId = await signInEditor(api);
  const created = await api.post(`/api/teams/${teamId}/studies`, { data: { name } });
  expect(created.status()).toBe(201);
  const study = await created.json();
  const base = `/api/teams/${teamId}/studies/${study.id}`;
  expect((await api.put(`${base}/definition`, { data: { definition } })).status()).toBe(200);
  const job = await api.post(`${base}/design/jobs`, {
    data: { method: 'random', tasks: 8, blocks: 2, seed: 11 },
  });
  expect(job.status()).toBe(202);
  await expect
    .poll(async () => (await (await api.get(`${base}/design`)).json()).design !== null, {
      timeout: 60_000,
    })
    .toBe(true);
  const saved = await api.put(`${base}/questionnaire`, {
    data: { questionnaire },
  });
  expect(saved.status()).toBe(200);
  const live = await api.post(`${base}/lifecycle/go-live`);
  expect(live.status(), await live.text()).toBe(200);
  return { teamId, studyId: study.id as string, publicId: study.publicId as string, base };
}
