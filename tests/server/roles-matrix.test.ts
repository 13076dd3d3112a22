/**
 * Every team route × every kind of caller, checked against shared/permissions.ts: a member whose
 * role lacks the permission gets 403, a signed-in outsider 404 (the team's existence is not
 * revealed), an anonymous caller 401 — and none of those refused calls changes anything.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import type supertest from 'supertest';
import { randomBytes } from 'node:crypto';
import { useTestApp } from '../support/test-app';
import { createTeamWithAllRoles, uniqueEmail } from '../support/factories';
import { listMailTo } from '../support/mailbox';
import { insertUser } from '../../db/queries/users';
import { insertMembership } from '../../db/queries/memberships';
import { insertInvitation } from '../../db/queries/tokens';
import { roleCan, roles, type Permission, type Role } from '../../shared/permissions';

type Caller = Role | 'outsider' | 'anonymous';
const callers: Caller[] = [...roles, 'outsider', 'anonymous'];

/** Fresh things a call may act on, so allowed calls never disturb the next case. */
type Targets = { teamId: string; memberId: string; invitationId: string; inviteEmail: string };

type RouteCase = {
  route: string;
  /** null: any signed-in user may call it (not team-scoped). */
  permission: Permission | null;
  okStatus: number;
  call: (agent: supertest.Agent, x: Targets) => supertest.Test;
};

const routeCases: RouteCase[] = [
  { route: 'GET /api/teams', permission: null, okStatus: 200, call: (a) => a.get('/api/teams') },
  {
    route: 'POST /api/teams',
    permission: null,
    okStatus: 201,
    call: (a) => a.post('/api/teams').send({ name: 'Side project' }),
  },
  {
    route: 'GET /api/teams/:teamId',
    permission: 'team:read',
    okStatus: 200,
    call: (a, x) => a.get(`/api/teams/${x.teamId}`),
  },
  {
    route: 'PATCH /api/teams/:teamId',
    permission: 'team:manage',
    okStatus: 200,
    call: (a, x) => a.patch(`/api/teams/${x.teamId}`).send({ name: 'Taken over' }),
  },
  {
    route: 'GET /api/teams/:teamId/members',
    permission: 'team:read',
    okStatus: 200,
    call: (a, x) => a.get(`/api/teams/${x.teamId}/members`),
  },
  {
    route: 'PATCH /api/teams/:teamId/members/:userId',
    permission: 'team:manage',
    okStatus: 200,
    call: (a, x) => a.patch(`/api/teams/${x.teamId}/members/${x.memberId}`).send({ role: 'owner' }),
  },
  {
    route: 'DELETE /api/teams/:teamId/members/:userId',
    permission: 'team:manage',
    okStatus: 204,
    call: (a, x) => a.delete(`/api/teams/${x.teamId}/members/${x.memberId}`),
  },
  {
    route: 'GET /api/teams/:teamId/invitations',
    permission: 'team:manage',
    okStatus: 200,
    call: (a, x) => a.get(`/api/teams/${x.teamId}/invitations`),
  },
  {
    route: 'POST /api/teams/:teamId/invitations',
    permission: 'team:manage',
    okStatus: 201,
    call: (a, x) =>
      a.post(`/api/teams/${x.teamId}/invitations`).send({ email: x.inviteEmail, role: 'editor' }),
  },
  {
    route: 'DELETE /api/teams/:teamId/invitations/:invitationId',
    permission: 'team:manage',
    okStatus: 204,
    call: (a, x) => a.delete(`/api/teams/${x.teamId}/invitations/${x.invitationId}`),
  },
];

function expectedStatus(c: RouteCase, caller: Caller): number {
  if (caller === 'anonymous') return 401;
  if (c.permission === null) return c.okStatus;
  if (caller === 'outsider') return 404;
  return roleCan(caller, c.permission) ? c.okStatus : 403;
}

const errorCode: Record<number, string> = {
  401: 'unauthenticated',
  403: 'forbidden',
  404: 'not_found',
};

const t = useTestApp();
let world: Awaited<ReturnType<typeof createTeamWithAllRoles>>;

beforeAll(async () => {
  world = await createTeamWithAllRoles(t);
});

function agentFor(caller: Caller): supertest.Agent {
  if (caller === 'anonymous') return t.request();
  if (caller === 'outsider') return world.outsider;
  return world.agents[caller];
}

async function freshTargets(): Promise<Targets> {
  const member = await insertUser(t.deps.db, {
    email: uniqueEmail('target'),
    name: 'Target member',
    // Never signs in: any stored string will do.
    passwordHash: 'not-a-bcrypt-hash',
  });
  await insertMembership(t.deps.db, { teamId: world.teamId, userId: member.id, role: 'viewer' });
  const invitation = await insertInvitation(t.deps.db, {
    teamId: world.teamId,
    email: uniqueEmail('pending'),
    role: 'viewer',
    tokenHash: randomBytes(32).toString('hex'),
    invitedBy: world.users.owner,
    expiresAt: new Date(Date.now() + 86_400_000),
  });
  return {
    teamId: world.teamId,
    memberId: member.id,
    invitationId: invitation.id,
    inviteEmail: uniqueEmail('invitee'),
  };
}

/** Everything a team route could change, as plain rows in a stable order. */
async function snapshot(teamId: string) {
  const rows = async (q: ReturnType<typeof sql>) => (await t.deps.db.execute(q)).rows;
  return {
    team: await rows(sql`select id, name from teams where id = ${teamId}`),
    members: await rows(
      sql`select user_id, role from memberships where team_id = ${teamId} order by user_id`,
    ),
    invitations: await rows(
      sql`select id, email, role, accepted_at, revoked_at from team_invitations
          where team_id = ${teamId} order by id`,
    ),
    teamCount: await rows(sql`select count(*)::int as n from teams`),
  };
}

describe.each(routeCases)('$route', (c) => {
  it.each(callers)('as %s', async (caller) => {
    const x = await freshTargets();
    const before = await snapshot(x.teamId);
    const want = expectedStatus(c, caller);

    const res = await c.call(agentFor(caller), x);

    expect(res.status, `${c.route} as ${caller}`).toBe(want);
    if (want >= 400) {
      expect(res.body.error.code).toBe(errorCode[want]);
      expect(await snapshot(x.teamId)).toEqual(before);
      expect(await listMailTo(x.inviteEmail)).toEqual([]);
    }
  });
});

describe('the matrix itself', () => {
  it('covers every role and refuses team:manage routes to all but the owner', () => {
    const manage = routeCases.filter((c) => c.permission === 'team:manage');
    expect(manage.length).toBe(6);
    const allowed = roles.filter((r) => manage.every((c) => expectedStatus(c, r) < 400));
    expect(allowed).toEqual(['owner']);
  });
});
