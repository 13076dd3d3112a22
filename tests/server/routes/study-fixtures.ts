/** Factories for study tests: a small valid definition and a study created through the API. */
import type supertest from 'supertest';
import type { StudyDefinition } from '../../../shared/schemas/study-definition';
import {
  makeStudyDefinition,
  numericLevels,
  riverRating,
} from '../../../scripts/lib/study-factory/definition';
import {
  createStudyThroughApi,
  type StudyApiCall,
} from '../../../scripts/lib/study-factory/api-study';

/**
 * Two attributes (a numeric cost, a categorical rating), two unlabeled packages. Overrides are
 * not checked, so a test can send a definition the API must refuse.
 */
export function makeSmallDefinition(overrides: Partial<StudyDefinition> = {}): StudyDefinition {
  const small = makeStudyDefinition({
    only: ['bill', 'river'],
    attributes: {
      bill: { levels: numericLevels('b', [0, 5, 10], (v) => `€${v}`) },
      river: { ...riverRating(), referenceLevelId: 'poor' },
    },
    fixedAlternative: null,
  });
  return { ...small, ...overrides };
}

/** The study factory's requests sent by a supertest agent. */
export const supertestCall =
  (agent: supertest.Agent): StudyApiCall =>
  async (method, url, body) => {
    const req = agent[method](url);
    const res = await (body === undefined ? req : req.send(body as object));
    return { status: res.status, body: res.body };
  };

/** A draft created through the API, with a definition saved when given (no design). */
export async function createStudyVia(
  agent: supertest.Agent,
  teamId: string,
  overrides: Partial<{ name: string; description: string; definition: StudyDefinition }> = {},
) {
  const { id, publicId } = await createStudyThroughApi(supertestCall(agent), teamId, {
    ...overrides,
    designJob: null,
  });
  return { id, publicId };
}
