/**
 * The usual set-up of a route test file: one test app for the file and one signed-in team
 * owner, made before the tests and closed after them. Read the fields inside tests.
 */
import { afterAll, beforeAll } from 'vitest';
import type supertest from 'supertest';
import { createTestApp, type TestApp } from './test-app';
import { createTeamWithAllRoles, signUpOwner } from './factories';

export type OwnerApp = { t: TestApp; owner: supertest.Agent; teamId: string };

export function ownerAppForFile(): OwnerApp {
  const app = {} as OwnerApp;
  beforeAll(async () => {
    app.t = await createTestApp();
    const { agent, teamId } = await signUpOwner(app.t);
    Object.assign(app, { owner: agent, teamId });
  });
  afterAll(async () => {
    await app.t.close();
  });
  return app;
}

export type TeamApp = { t: TestApp; team: Awaited<ReturnType<typeof createTeamWithAllRoles>> };

/** One test app for the file and a team with a signed-in member of every role (and an outsider). */
export function teamAppForFile(): TeamApp {
  const app = {} as TeamApp;
  beforeAll(async () => {
    app.t = await createTestApp();
    app.team = await createTeamWithAllRoles(app.t);
  });
  afterAll(async () => {
    await app.t.close();
  });
  return app;
}
