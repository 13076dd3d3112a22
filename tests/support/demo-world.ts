/**
 * The demo study seeded once for the test files that need it (the seed answers about 400
 * respondents through the fieldwork services, the slowest set-up of the suite): a team with
 * its owner, the demo study, and ensureDemoResponses' first-run result and time.
 */
import { createTestApp, type TestApp } from './test-app';
import { ensureDemoResponses } from '../../server/seed/demo-responses';
import { createDemoStudy } from '../../scripts/lib/study-factory/demo-study';

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
  const demo = await createDemoStudy(t.deps.db, { ownerEmail: 'owner@larkspur.example.test' });
  const t0 = performance.now();
  const firstRun = await ensureDemoResponses(t.deps.db, { studyId: demo.studyId });
  const seedSeconds = (performance.now() - t0) / 1000;
  return {
    t,
    teamId: demo.teamId,
    userId: demo.ownerId,
    studyId: demo.studyId,
    firstRun,
    seedSeconds,
  };
}
