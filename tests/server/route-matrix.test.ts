/**
 * The access matrix, generated: every API route is read from the Express routers themselves
 * (server/lib/route-table.ts), so a route added later is in the matrix without anyone listing
 * it, and a route without an access declaration fails here. Each route is called as anonymous,
 * as a respondent of another study (their session token, no account), as a member of another
 * team and as each role, and must answer as its declaration and shared/permissions.ts say:
 * 401 without an account, 404 to a non-member (the team's existence is not revealed), 403 to a
 * role without the permission, and through to the handler otherwise. No refused call changes
 * the database. Respondent routes bound to a session refuse another study's session token.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import type supertest from 'supertest';
import { useTestApp } from '../support/test-app';
import { createTeamWithAllRoles, signUpOwner } from '../support/factories';
import { databaseFingerprint } from '../support/db-fingerprint';
import {
  answerFor,
  insertStudy,
  startLiveSession,
  type LiveScreen,
} from './routes/respond-fixtures';
import { listApiRoutes, type RouteEntry } from '../../server/lib/route-table';
import type { RouteAccess } from '../../server/middleware/access';
import { roleCan, roles, type Permission, type Role } from '../../shared/permissions';

type Caller = Role | 'outsider' | 'anonymous' | 'respondent';
const callers: Caller[] = [...roles, 'outsider', 'anonymous', 'respondent'];

type Rule = { kind: 'public' } | { kind: 'user' } | { kind: 'team'; permission: Permission };

/** The strictest declaration on the route: team over user over public; none is an error. */
function ruleOf(route: RouteEntry): Rule | null {
  const team = route.access.filter(
    (a): a is Extract<RouteAccess, { kind: 'team' }> => a.kind === 'team',
  );
  if (team.length > 0) return { kind: 'team', permission: team[team.length - 1]!.permission };
  if (route.access.some((a) => a.kind === 'user')) return { kind: 'user' };
  if (route.access.some((a) => a.kind === 'public')) return { kind: 'public' };
  return null;
}

/** null: the caller gets through to the handler (any status but 401, 403 or 5xx). */
function refusal(rule: Rule, caller: Caller): { status: number; code: string } | null {
  if (rule.kind === 'public') return null;
  if (caller === 'anonymous' || caller === 'respondent')
    return { status: 401, code: 'unauthenticated' };
  if (rule.kind === 'user') return null;
  if (caller === 'outsider') return { status: 404, code: 'not_found' };
  return roleCan(caller, rule.permission) ? null : { status: 403, code: 'forbidden' };
}

/** Respondent routes that act on one session: another study's session token must not reach it. */
const SESSION_ROUTES = ['GET /session', 'POST /answers', 'POST /revisions', 'POST /language'];
const OPEN_LINK_ROUTES = ['GET ', 'POST /sessions'];

const t = useTestApp();
let world: Awaited<ReturnType<typeof createTeamWithAllRoles>>;
let routes: RouteEntry[];
/** A live study of another team with one respondent session: its token is the "respondent". */
let otherToken: string;
let livePublicId: string;
let liveScreens: LiveScreen[];
let liveToken: string;

beforeAll(async () => {
  world = await createTeamWithAllRoles(t);
  routes = listApiRoutes(t.app);
  const elsewhere = await signUpOwner(t, { teamName: 'Another utility' });
  const other = await startLiveSession(t, elsewhere.agent, elsewhere.teamId);
  otherToken = other.session.sessionToken;
  const live = await startLiveSession(t, world.agents.owner, world.teamId);
  livePublicId = live.study.publicId;
  liveScreens = live.session.screens;
  liveToken = live.session.sessionToken;
});

function agentFor(caller: Caller): supertest.Agent {
  if (caller === 'anonymous' || caller === 'respondent') return t.request();
  if (caller === 'outsider') return world.outsider;
  return world.agents[caller];
}

/** The route's path with real team and study ids (a fresh study each time) and random others. */
async function pathFor(route: RouteEntry): Promise<string> {
  const study = route.params.includes('studyId')
    ? await insertStudy(t, world.teamId)
    : { id: '', publicId: '' };
  return route.path.replace(/:(\w+)/g, (_m, name: string) => {
    if (name === 'teamId') return world.teamId;
    if (name === 'studyId') return study.id;
    if (name === 'publicId') return livePublicId;
    if (name === 'token') return 'x'.repeat(43);
    return randomUUID();
  });
}

function call(
  agent: supertest.Agent,
  method: string,
  path: string,
  caller: Caller,
  body: object = {},
) {
  const req = agent[method.toLowerCase() as 'get'](path);
  if (caller === 'respondent') req.set('x-respondent-token', otherToken);
  return method === 'GET' || method === 'DELETE' ? req : req.send(body);
}

describe('the route table', () => {
  it('lists every API route, each with an access declaration', () => {
    expect(routes.length).toBeGreaterThan(90);
    const undeclared = routes.filter((r) => ruleOf(r) === null);
    expect(undeclared.map((r) => `${r.method} ${r.path}`)).toEqual([]);
  });

  it('knows every respondent route as open to the link or bound to a session', () => {
    const respond = routes
      .filter((r) => r.path.startsWith('/api/r/:publicId'))
      .map((r) => `${r.method} ${r.path.slice('/api/r/:publicId'.length)}`);
    expect(respond.sort()).toEqual([...OPEN_LINK_ROUTES, ...SESSION_ROUTES].sort());
  });
});

describe('every account and team route × every caller', () => {
  it('answers as the declaration says, and no refused call changes anything', async () => {
    const guarded = routes.filter((r) => ruleOf(r)!.kind !== 'public');
    const seen: string[] = [];
    let cases = 0;
    for (const route of guarded) {
      const rule = ruleOf(route)!;
      const name = `${route.method} ${route.path}`;
      const path = await pathFor(route);
      const before = await databaseFingerprint(t.deps.db);
      for (const caller of callers) {
        const want = refusal(rule, caller);
        if (!want) continue;
        const res = await call(agentFor(caller), route.method, path, caller);
        cases++;
        expect(res.status, `${name} as ${caller}`).toBe(want.status);
        expect(res.body.error?.code, `${name} as ${caller}`).toBe(want.code);
      }
      expect(await databaseFingerprint(t.deps.db), `${name}: a refused call changed data`).toEqual(
        before,
      );
      // Allowed callers last (they may change the fresh study); account routes that end
      // sessions run as a throwaway user so the role agents stay signed in.
      const allowed = callers.filter((c) => refusal(rule, c) === null);
      const throwaway = rule.kind === 'user' && route.method !== 'GET';
      for (const caller of throwaway ? allowed.slice(0, 1) : allowed) {
        const agent = throwaway ? (await signUpOwner(t)).agent : agentFor(caller);
        const res = await call(agent, route.method, path, caller);
        cases++;
        expect([401, 403], `${name} as ${caller} was refused`).not.toContain(res.status);
        expect(res.status, `${name} as ${caller}: ${res.text.slice(0, 200)}`).toBeLessThan(500);
      }
      seen.push(name);
    }
    expect(seen.length).toBe(guarded.length);
    // 79 guarded routes and 533 calls when this was written (95 routes in all).
    expect(cases).toBeGreaterThan(guarded.length * 5);
  }, 600_000);
});

describe("respondent routes with another study's session token", () => {
  it.each(SESSION_ROUTES)('%s is refused and changes nothing', async (which) => {
    const [method, suffix] = which.split(' ') as [string, string];
    const before = await databaseFingerprint(t.deps.db);
    // A well-formed answer to the study's first screen: only the token is wrong.
    const body = answerFor(liveScreens[0]!);
    const res = await call(
      t.request(),
      method,
      `/api/r/${livePublicId}${suffix}`,
      'respondent',
      body,
    );
    expect([401, 403, 404]).toContain(res.status);
    expect(res.body.error.code).toEqual(expect.any(String));
    expect(await databaseFingerprint(t.deps.db)).toEqual(before);
  });

  it("the same requests with the study's own token get through", async () => {
    const own = (method: 'get' | 'post', suffix: string) =>
      t.request()[method](`/api/r/${livePublicId}${suffix}`).set('x-respondent-token', liveToken);
    expect((await own('get', '/session')).status).toBe(200);
    const answered = await own('post', '/answers').send(answerFor(liveScreens[0]!));
    expect(answered.status).toBeLessThan(300);
  });
});
