/** Factories with overrides: people with a role in a team, signed in through the real API. */
import { randomBytes } from 'node:crypto';
import type supertest from 'supertest';
import type { Role } from '../../shared/permissions';
import type { TestApp } from './test-app';
import type { Actor } from '../../server/services/actor';
import { firstLink, waitForMailWithSubject } from './mailbox';
import { hashPassword } from '../../server/lib/passwords';
import { insertUser } from '../../db/queries/users';
import { insertMembership, insertTeam } from '../../db/queries/memberships';

export const TEST_PASSWORD = 'correct horse battery';

/**
 * The stored hash of TEST_PASSWORD, made once per test process and given to every factory user:
 * an Argon2id hash costs about 40 ms of CPU by design (server/lib/passwords.ts), and the suite
 * creates hundreds of users. Sign-in still verifies it as for any other user.
 */
let testPasswordHash: Promise<string> | undefined;
const hashTestPassword = () => (testPasswordHash ??= hashPassword(TEST_PASSWORD));

export function uniqueEmail(prefix = 'user'): string {
  return `${prefix}-${randomBytes(4).toString('hex')}@example.test`;
}

/**
 * A confirmed user who owns a new team (as sign-up plus the confirmation link would leave them),
 * signed in through the real sign-in route. Sign-up itself is tested in tests/server/routes/auth.
 */
export async function signUpOwner(
  t: TestApp,
  overrides: Partial<{ name: string; email: string; teamName: string }> = {},
) {
  const email = overrides.email ?? uniqueEmail('owner');
  const user = await insertUser(t.deps.db, {
    email,
    name: overrides.name ?? 'Olive Owner',
    passwordHash: await hashTestPassword(),
    emailVerifiedAt: new Date(),
  });
  const team = await insertTeam(t.deps.db, {
    name: overrides.teamName ?? 'Larkspur Valley Water research',
  });
  await insertMembership(t.deps.db, { teamId: team.id, userId: user.id, role: 'owner' });
  const agent = t.request();
  const res = await agent
    .post('/api/auth/sign-in')
    .send({ email, password: TEST_PASSWORD })
    .expect(200);
  return {
    agent,
    user: res.body as { id: string; email: string; teams: { id: string }[] },
    teamId: team.id,
  };
}

/** Adds a user with the given role directly (faster than the invitation flow) and signs them in. */
export async function addMember(t: TestApp, teamId: string, role: Role, email = uniqueEmail(role)) {
  const user = await insertUser(t.deps.db, {
    email,
    name: `${role} person`,
    passwordHash: await hashTestPassword(),
    emailVerifiedAt: new Date(),
  });
  await insertMembership(t.deps.db, { teamId, userId: user.id, role });
  const agent = t.request();
  await agent.post('/api/auth/sign-in').send({ email, password: TEST_PASSWORD }).expect(200);
  return { agent, user };
}

/** A team with one signed-in member of every role. */
export async function createTeamWithAllRoles(t: TestApp) {
  const owner = await signUpOwner(t);
  const editor = await addMember(t, owner.teamId, 'editor');
  const analyst = await addMember(t, owner.teamId, 'analyst');
  const viewer = await addMember(t, owner.teamId, 'viewer');
  const outsider = await signUpOwner(t, { teamName: 'Another utility' });
  return {
    teamId: owner.teamId,
    agents: {
      owner: owner.agent,
      editor: editor.agent,
      analyst: analyst.agent,
      viewer: viewer.agent,
    } as Record<Role, supertest.Agent>,
    users: {
      owner: owner.user.id,
      editor: editor.user.id,
      analyst: analyst.user.id,
      viewer: viewer.user.id,
    } as Record<Role, string>,
    outsider: outsider.agent,
  };
}

export async function createBareTeam(t: TestApp, name = 'Bare team') {
  return insertTeam(t.deps.db, { name });
}

/** The caller of a team use case, for tests that call a service directly (not over HTTP). */
export function teamActor(a: { teamId: string; userId: string } & Partial<Actor>): Actor {
  return { role: 'owner', email: 'caller@example.test', name: 'Test caller', ...a };
}

export const randomHex = (n = 4) => randomBytes(n).toString('hex');

/** Signs up through the API and opens the confirmation link from the mail: a signed-in agent. */
export async function signUpAndConfirm(
  t: TestApp,
  p: { name?: string; email?: string; teamName?: string } = {},
) {
  const email = p.email ?? uniqueEmail('signup');
  const agent = t.request();
  await agent
    .post('/api/auth/sign-up')
    .send({
      name: p.name ?? 'Ines Invitee',
      email,
      password: TEST_PASSWORD,
      teamName: p.teamName ?? 'Own team',
    })
    .expect(202);
  const mail = await waitForMailWithSubject(email, /^Confirm your e-mail address/);
  const token = new URL(firstLink(mail.text)).searchParams.get('token')!;
  const res = await agent.post('/api/auth/confirm-email').send({ token }).expect(200);
  return { agent, user: res.body as { id: string; email: string; teams: { id: string }[] } };
}
