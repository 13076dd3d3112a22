/** Factories for study tests: a small valid definition and a study created through the API. */
import type supertest from 'supertest';
import type { StudyDefinition } from '../../../shared/schemas/study-definition';

/** Two attributes (a numeric cost, a categorical rating), two unlabeled packages. */
export function makeSmallDefinition(overrides: Partial<StudyDefinition> = {}): StudyDefinition {
  return {
    attributes: [
      {
        id: 'bill',
        name: 'Monthly bill increase',
        kind: 'numeric',
        unit: '€',
        isCost: true,
        coding: 'linear',
        levels: [0, 5, 10].map((v) => ({ id: `b${v}`, label: `€${v}`, value: v })),
      },
      {
        id: 'river',
        name: 'River health rating',
        kind: 'categorical',
        isCost: false,
        coding: 'dummy',
        referenceLevelId: 'poor',
        levels: [
          { id: 'poor', label: 'Poor' },
          { id: 'fair', label: 'Fair' },
          { id: 'good', label: 'Good' },
        ],
      },
    ],
    alternatives: { count: 2, labeled: false, labels: [] },
    fixedAlternative: null,
    excludedCombinations: [],
    ...overrides,
  };
}

export async function createStudyVia(
  agent: supertest.Agent,
  teamId: string,
  overrides: Partial<{ name: string; description: string; definition: StudyDefinition }> = {},
) {
  const res = await agent
    .post(`/api/teams/${teamId}/studies`)
    .send({
      name: overrides.name ?? 'Water service packages',
      description: overrides.description ?? '',
    })
    .expect(201);
  const id = res.body.id as string;
  if (overrides.definition !== undefined)
    await agent
      .put(`/api/teams/${teamId}/studies/${id}/definition`)
      .send({ definition: overrides.definition })
      .expect(200);
  return { id, publicId: res.body.publicId as string };
}
