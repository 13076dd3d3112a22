/**
 * Sets up a live Larkspur Valley Water study through the API as the demo editor, so the
 * respondent journey does not depend on the state of the seeded demo study.
 */
import { demoCredential } from './demo-credentials';
import { expect, type APIRequestContext } from '@playwright/test';
import { makeStudyDefinition } from '../../scripts/lib/study-factory/definition';
import {
  createStudyThroughApi,
  type StudyApiCall,
} from '../../scripts/lib/study-factory/api-study';
import type { Questionnaire } from '../../shared/schemas/questionnaire';
import type { StudyDefinition } from '../../shared/schemas/study-definition';

/** The study factory's Larkspur definition: what every journey's study asks. */
export const larkspurDefinition: StudyDefinition = makeStudyDefinition();

/** The study factory's requests sent through a Playwright request context. */
export const playwrightCall =
  (api: APIRequestContext): StudyApiCall =>
  async (method, url, body) => {
    const res = await api[method](url, body === undefined ? {} : { data: body });
    const text = await res.text();
    return { status: res.status(), body: text ? JSON.parse(text) : null };
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
  const teamId = await signInEditor(api);
  const study = await createStudyThroughApi(playwrightCall(api), teamId, {
    name,
    definition: options.definition ?? larkspurDefinition,
    questionnaire: options.questionnaire,
    goLive: true,
  });
  return { teamId, studyId: study.id, publicId: study.publicId, base: study.base };
}
