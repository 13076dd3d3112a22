/**
 * Fuzzing every API route (read from the Express routers, so new routes are fuzzed too) with
 * generated bodies, query strings, path parameters and content types (fast-check, fixed seed):
 * public routes anonymously and with a respondent's session token, team and account routes as
 * a signed-in owner. Properties: never a 5xx, every refusal in the one error shape (code and
 * message; a 400 on invalid input names its fields), and a route that refused every generated
 * request changed nothing in the database.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type supertest from 'supertest';
import { useTestApp } from '../support/test-app';
import { signUpOwner } from '../support/factories';
import { databaseFingerprint } from '../support/db-fingerprint';
import { hostileText } from '../support/hostile-text';
import { insertStudy, startLiveSession } from './routes/respond-fixtures';
import { listApiRoutes, type RouteEntry } from '../../server/lib/route-table';

/** Requests per route; the seed makes every run replay the same requests. */
const RUNS = 10;
const SEED = 1301;

/** Field names the schemas use, so generated objects reach past the first check. */
const FIELD_NAMES = [
  'name',
  'email',
  'password',
  'role',
  'reason',
  'by',
  'value',
  'token',
  'title',
  'definition',
  'attributes',
  'levels',
  'spec',
  'model',
  'coefficients',
  'questionnaire',
  'pages',
  'flags',
  'included',
  'clientId',
  'screenKey',
  'settings',
  'design',
  'blocks',
  'tasks',
  'runId',
  'filterId',
  'scenario',
  'alternatives',
  'draws',
  'seed',
  'cost',
];

const hostileValue: fc.Arbitrary<unknown> = fc.letrec((tie) => ({
  leaf: fc.oneof(
    hostileText(),
    fc.constantFrom(
      '',
      ' ',
      '\u0000',
      '../../etc/passwd',
      "' or 1=1 --",
      '<img src=x>',
      'x'.repeat(5000),
    ),
    fc.integer(),
    fc.double({ noNaN: true }),
    fc.constantFrom(0, -1, 2 ** 31, Number.MAX_SAFE_INTEGER, 1e308),
    fc.boolean(),
    fc.constant(null),
    fc.uuid(),
  ),
  node: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    tie('leaf'),
    fc.array(tie('node'), { maxLength: 4 }),
    fc.dictionary(fc.constantFrom(...FIELD_NAMES), tie('node'), { maxKeys: 5 }),
  ),
})).node;

type Body = { kind: 'json'; value: unknown } | { kind: 'raw'; contentType: string; text: string };

const bodyArb: fc.Arbitrary<Body> = fc.oneof(
  { weight: 4, arbitrary: hostileValue.map((value) => ({ kind: 'json' as const, value })) },
  {
    weight: 1,
    arbitrary: fc
      .tuple(
        fc.constantFrom(
          'application/json',
          'text/plain',
          'application/x-www-form-urlencoded',
          'multipart/form-data; boundary=x',
          'application/xml',
        ),
        fc.oneof(fc.constantFrom('{"name":', '[1,2', 'null', '"x"', '--x--'), fc.string()),
      )
      .map(([contentType, text]) => ({ kind: 'raw' as const, contentType, text })),
  },
);

/** A path segment: usually valid, often garbage (percent-encoding tricks, traversal, huge). */
const segmentArb = (real: string) =>
  fc.oneof(
    { weight: 3, arbitrary: fc.constant(real) },
    { weight: 1, arbitrary: fc.uuid() },
    {
      weight: 2,
      arbitrary: fc.oneof(
        fc.string({ maxLength: 40 }).map(encodeURIComponent),
        fc.constantFrom('%00', '..', '%2e%2e%2f', '%E0%A4%A', '%', 'null', '-1', 'x'.repeat(300)),
      ),
    },
  );

const queryArb = fc.dictionary(
  fc.constantFrom(
    'page',
    'pageSize',
    'runId',
    'sort',
    'order',
    'status',
    'flag',
    'limit',
    'before',
    'from',
    'inv',
    'pid',
  ),
  fc.oneof(hostileText(), fc.integer().map(String), fc.uuid()),
  { maxKeys: 4 },
);

const t = useTestApp();
let owner: Awaited<ReturnType<typeof signUpOwner>>;
let routes: RouteEntry[];
let real: Record<string, string>;
let respondentToken: string;

beforeAll(async () => {
  owner = await signUpOwner(t);
  routes = listApiRoutes(t.app);
  const live = await startLiveSession(t, owner.agent, owner.teamId);
  const draft = await insertStudy(t, owner.teamId);
  respondentToken = live.session.sessionToken;
  real = { teamId: owner.teamId, studyId: draft.id, publicId: live.study.publicId };
});

function isPublic(route: RouteEntry): boolean {
  return route.access.every((a) => a.kind === 'public');
}

async function agentFor(route: RouteEntry): Promise<supertest.Agent> {
  if (isPublic(route)) return t.request();
  // Account routes can end the caller's sessions: a throwaway account keeps the owner signed in.
  if (route.path.startsWith('/api/account') || route.path.startsWith('/api/auth'))
    return (await signUpOwner(t)).agent;
  return owner.agent;
}

function send(
  agent: supertest.Agent,
  route: RouteEntry,
  path: string,
  query: Record<string, string>,
  body: Body,
  token: boolean,
) {
  const req = agent[route.method.toLowerCase() as 'post'](path).query(query);
  if (token) req.set('x-respondent-token', respondentToken);
  if (route.method === 'GET' || route.method === 'DELETE') return req;
  // Serialised here: superagent sends only objects and strings as JSON, and every JSON value
  // (a bare number, null, a string) is a body a client can send.
  if (body.kind === 'json')
    return req.set('Content-Type', 'application/json').send(JSON.stringify(body.value) ?? 'null');
  return req.set('Content-Type', body.contentType).send(body.text);
}

function expectErrorShape(res: supertest.Response, what: string) {
  expect(res.status, `${what}: ${res.text.slice(0, 300)}`).toBeLessThan(500);
  if (res.status < 400) return;
  const error = res.body?.error;
  expect(typeof error?.code, `${what}: error code`).toBe('string');
  expect(typeof error?.message, `${what}: error message`).toBe('string');
  expect(error.message.length, `${what}: error message`).toBeGreaterThan(0);
  if (res.status === 400 && error.code === 'invalid_input') {
    expect(Array.isArray(error.fields), `${what}: fields`).toBe(true);
    for (const f of error.fields) {
      expect(typeof f.path).toBe('string');
      expect(typeof f.message).toBe('string');
    }
  }
}

describe('fuzzing every route', () => {
  it('never answers 5xx, always in the one error shape; refused routes change nothing', async () => {
    let cases = 0;
    let accepted = 0;
    for (const [index, route] of routes.entries()) {
      const agent = await agentFor(route);
      const before = await databaseFingerprint(t.deps.db);
      let allRefused = true;
      const paramArbs = route.params.map((p) => segmentArb(real[p] ?? crypto.randomUUID()));
      await fc.assert(
        fc.asyncProperty(
          fc.tuple(...paramArbs),
          queryArb,
          bodyArb,
          fc.boolean(),
          async (params, query, body, token) => {
            let i = 0;
            const path = route.path.replace(/:(\w+)/g, () => params[i++]!);
            const what = `${route.method} ${path}`;
            const res = await send(agent, route, path, query, body, token);
            cases++;
            if (res.status < 400) {
              allRefused = false;
              accepted++;
            }
            expectErrorShape(res, what);
          },
        ),
        { numRuns: RUNS, seed: SEED + index, endOnFailure: true },
      );
      if (allRefused)
        expect(
          await databaseFingerprint(t.deps.db),
          `${route.method} ${route.path} refused every request but changed data`,
        ).toEqual(before);
    }
    // 95 routes × 10 = 950 requests when this was written, about 150 of them accepted.
    expect(cases).toBe(routes.length * RUNS);
    // Most generated requests are nonsense; a few valid ones get through (GETs mostly).
    expect(accepted).toBeLessThan(cases);
  }, 900_000);
});
