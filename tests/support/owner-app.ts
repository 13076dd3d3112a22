/**
 * The usual set-up of a route test file: one test app for the file and one signed-in team
 * owner, made before the tests and closed after them. Read the fields inside tests.
 */
import { beforeAll } from 'vitest';
import type supertest from 'supertest';
import { useTestApp, type TestApp } from './test-app';
import { createTeamWithAllRoles, signUpOwner } from './factories';

export type OwnerApp = { t: TestApp; owner: supertest.Agent; teamId: string };

export function ownerAppForFile(): OwnerApp {
  const app = { t: useTestApp() } as OwnerApp;
  beforeAll(async () => {
    const { agent, teamId } = await signUpOwner(app.t);
    Object.assign(app, { owner: agent, teamId });
  });
  return app;
}

export type TeamApp = { t: TestApp; team: Awaited<ReturnType<typeof createTeamWithAllRoles>> };

/** One test app for the file and a team with a signed-in member of every role (and an outsider). */
export function teamAppForFile(): TeamApp {
  const app = { t: useTestApp() } as TeamApp;
  beforeAll(async () => {
    app.team = await createTeamWithAllRoles(app.t);
  });
  return app;
}
