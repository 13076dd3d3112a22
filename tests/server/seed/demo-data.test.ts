/**
 * The demo data, seeded once (tests/support/demo-world.ts): the seed's own checks first, then
 * the recovery of the simulated population by the product's estimation path, which excludes
 * flagged respondents (so it must come second).
 */
import { afterAll, beforeAll } from 'vitest';
import { seedDemoWorld, type DemoWorld } from '../../support/demo-world';
import { describeDemoResponses } from './demo-responses-checks';
import { describeDemoRecovery } from './demo-recovery-checks';

let world: DemoWorld;
beforeAll(async () => {
  world = await seedDemoWorld();
}, 180_000);
afterAll(async () => {
  await world?.t.close();
});

describeDemoResponses(() => world);
describeDemoRecovery(() => world);
