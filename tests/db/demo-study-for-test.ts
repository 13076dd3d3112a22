/**
 * The Larkspur Valley Water demo study as PRODUCT.md describes it, written into a test
 * database: bill increase (cost, linear), interruptions, warning days and renewable share
 * (linear, in the units DEMO_TRUTH uses), river health (dummy, reference poor), two unlabeled
 * packages and the status quo; a seeded design of 16 tasks in 2 blocks; the demo
 * questionnaire with its background questions. ensureDemoResponses then fills it.
 */
import { randomBytes } from 'node:crypto';
import type { Db } from '../../db/client';
import { insertUser } from '../../db/queries/users';
import { insertMembership, insertTeam } from '../../db/queries/memberships';
import { insertStudy, updateStudy } from '../../db/queries/studies';
import { insertDesign } from '../../db/queries/designs';
import { demoQuestionnaire } from '../../shared/schemas/questionnaire-defaults';
import { studyDefinitionSchema } from '../../shared/schemas/study-definition';
import { makeRandomDesign } from '../server/jobs/run-fixtures';

const numeric = (id: string, name: string, values: number[], unit: string, isCost = false) => ({
  id,
  name,
  kind: 'numeric',
  unit,
  isCost,
  coding: 'linear',
  levels: values.map((v) => ({ id: `${id}${v}`, label: `${v}`, value: v })),
});

export function makeDemoDefinition() {
  return studyDefinitionSchema.parse({
    attributes: [
      numeric('bill', 'Monthly bill increase', [0, 3, 6, 10, 15], '€', true),
      numeric('intr', 'Supply interruptions per year', [4, 2, 1], 'per year'),
      numeric('warn', 'Taste and odour warning days per year', [6, 2, 0], 'days'),
      {
        id: 'river',
        name: 'River health rating',
        kind: 'categorical',
        coding: 'dummy',
        levels: [
          { id: 'poor', label: 'poor' },
          { id: 'fair', label: 'fair' },
          { id: 'good', label: 'good' },
        ],
      },
      numeric('renew', 'Renewable pumping energy', [20, 50, 80], '%'),
    ],
    alternatives: { count: 2, labeled: false, labels: [] },
    fixedAlternative: {
      kind: 'status_quo',
      label: 'Current service',
      levels: { bill: 'bill0', intr: 'intr4', warn: 'warn6', river: 'poor', renew: 'renew20' },
    },
    prohibitions: [],
  });
}

export async function seedDemoStudyForTest(db: Db) {
  const user = await insertUser(db, {
    email: `owner-${randomBytes(4).toString('hex')}@example.test`,
    name: 'Demo owner',
    passwordHash: 'x',
  });
  const team = await insertTeam(db, { name: 'Larkspur Valley Water' });
  await insertMembership(db, { teamId: team.id, userId: user.id, role: 'owner' });
  const definition = makeDemoDefinition();
  const study = await insertStudy(db, {
    teamId: team.id,
    publicId: randomBytes(8).toString('hex'),
    name: 'Water service packages 2026–2030',
    description: 'Demo study',
    definition,
    questionnaire: demoQuestionnaire(definition),
    createdBy: user.id,
  });
  const design = await insertDesign(db, {
    studyId: study.id,
    teamId: team.id,
    method: 'random',
    spec: {},
    design: makeRandomDesign(definition, 2026),
    diagnostics: {},
    createdBy: user.id,
  });
  await updateStudy(db, { id: study.id, teamId: team.id, set: { currentDesignId: design.id } });
  return { teamId: team.id, userId: user.id, studyId: study.id, definition };
}
