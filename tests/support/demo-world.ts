/**
 * The demo study seeded once for the test files that need it (the seed answers about 400
 * respondents through the fieldwork services, the slowest set-up of the suite): a team with
 * its owner, the demo study, and ensureDemoResponses' first-run result and time.
 */
import { createTestApp, type TestApp } from './test-app';
import { ensureDemoStudy } from '../../server/seed/demo-study';
import { ensureDemoResponses } from '../../server/seed/demo-responses';
import { insertUser } from '../../db/queries/users';
import { insertMembership, insertTeam } from '../../db/queries/memberships';

export type DemoWorld = {
  t: TestApp;
  teamId: string;
  userId: string;
  studyId: string;
  firstRun: { created: number; total: number };
  seedSeconds: number;
};

export async function seedDemoWorld(): Promise<DemoWorld> {
  const t = await createTestApp();
  const team = await insertTeam(t.deps.db, { name: 'Larkspur Valley Water' });
  const owner = await insertUser(t.deps.db, {
    email: 'owner@larkspur.example.test',
    name: 'Demo owner',
    passwordHash: 'x',
  });
  await insertMembership(t.deps.db, { teamId: team.id, userId: owner.id, role: 'owner' });
  const studyId = await ensureDemoStudy(t.deps.db, { teamId: team.id, ownerId: owner.id });
  const t0 = performance.now();
  const firstRun = await ensureDemoResponses(t.deps.db, { studyId });
  const seedSeconds = (performance.now() - t0) / 1000;
  return { t, teamId: team.id, userId: owner.id, studyId, firstRun, seedSeconds };
}
