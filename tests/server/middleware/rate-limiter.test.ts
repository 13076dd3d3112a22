/**
 * The rate-limit middleware against the reference it replaces: express-rate-limit 8 with
 * `standardHeaders: 'draft-8'` (its headers follow draft-ietf-httpapi-ratelimit-headers-08).
 * Both count on an in-memory store of express-rate-limit's, so the same requests must give
 * the same statuses and the same RateLimit, RateLimit-Policy and Retry-After headers.
 */
import { describe, expect, it } from 'vitest';
import express, { type RequestHandler } from 'express';
import supertest from 'supertest';
import { MemoryStore, rateLimit, type Options } from 'express-rate-limit';
import {
  createRateLimiter,
  partitionKeyOf,
  policyName,
  type LimitHit,
  type LimitStore,
} from '../../../server/middleware/rate-limiter';

const refuse: Parameters<typeof createRateLimiter>[0]['refuse'] = (_req, res) => {
  res.status(429).json({ error: { code: 'rate_limited' } });
};
const keyOf = (req: express.Request) => req.get('x-key') ?? null;

function appWith(limiter: RequestHandler, status = 200) {
  const app = express();
  app.use(limiter);
  app.use((_req, res) => {
    res.status(status).json({ ok: true });
  });
  return app;
}

const reference = (limit: number, windowMs: number, failuresOnly = false) =>
  rateLimit({
    windowMs,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    store: new MemoryStore(),
    keyGenerator: (req) => keyOf(req) ?? '',
    skip: (req) => keyOf(req) === null,
    skipSuccessfulRequests: failuresOnly,
    handler: (req, res) => refuse(req, res),
  });

/** express-rate-limit's in-memory store, as the limiter's store. */
function memory(): LimitStore {
  const m = new MemoryStore();
  return {
    init: (o) => m.init(o as Options),
    increment: (key) => m.increment(key),
    decrement: (key) => m.decrement(key),
  };
}

const ours = (limit: number, windowMs: number, failuresOnly = false, store?: LimitStore) =>
  createRateLimiter({
    windowMs,
    limit,
    store: store ?? memory(),
    key: keyOf,
    failuresOnly,
    refuse,
    onStoreError: () => {},
  });

/** Status and rate-limit headers of each of `n` requests with the key. */
async function replies(app: express.Express, key: string | null, n: number) {
  const out = [];
  for (let i = 0; i < n; i++) {
    const req = supertest(app).get('/');
    const res = await (key === null ? req : req.set('x-key', key));
    out.push({
      status: res.status,
      rateLimit: res.headers['ratelimit'],
      policy: res.headers['ratelimit-policy'],
      retryAfter: res.headers['retry-after'],
    });
  }
  return out;
}

describe('createRateLimiter', () => {
  it('when a key goes over its limit, answers as express-rate-limit does: same statuses and headers', async () => {
    const windowMs = 15 * 60_000;
    const [theirs, mine] = await Promise.all([
      replies(appWith(reference(3, windowMs)), 'session:abc', 5),
      replies(appWith(ours(3, windowMs)), 'session:abc', 5),
    ]);
    expect(mine).toEqual(theirs);
    expect(mine.map((r) => r.status)).toEqual([200, 200, 200, 429, 429]);
    expect(mine[0].policy).toBe(`"3-in-15min"; q=3; w=900; pk=:${partitionKeyOf('session:abc')}:`);
    expect(mine[3].retryAfter).toBe('900');
  });

  it('when the key is null, counts nothing and sets no header, as express-rate-limit skips', async () => {
    const [theirs, mine] = await Promise.all([
      replies(appWith(reference(1, 60_000)), null, 3),
      replies(appWith(ours(1, 60_000)), null, 3),
    ]);
    expect(mine).toEqual(theirs);
    expect(mine.every((r) => r.status === 200 && r.policy === undefined)).toBe(true);
  });

  it('when only failures count, successes are given back as express-rate-limit gives them', async () => {
    for (const status of [200, 401]) {
      const [theirs, mine] = await Promise.all([
        replies(appWith(reference(2, 60_000, true), status), 'account:x', 4),
        replies(appWith(ours(2, 60_000, true), status), 'account:x', 4),
      ]);
      expect(mine.map((r) => r.status)).toEqual(theirs.map((r) => r.status));
    }
  });

  it('when the store counts in memory, decides without its promise; when it fails, lets the request through', async () => {
    const counted: string[] = [];
    const inMemory: LimitStore = {
      init: () => {},
      incrementNow: (key) => (counted.push(key), { totalHits: counted.length }),
      increment: () => Promise.reject(new Error('not expected')),
      decrement: async () => {},
    };
    expect(
      (await replies(appWith(ours(1, 60_000, false, inMemory)), 'k', 2)).map((r) => r.status),
    ).toEqual([200, 429]);
    const failing: LimitStore = {
      init: () => {},
      increment: (): Promise<LimitHit> => Promise.reject(new Error('database unreachable')),
      decrement: async () => {},
    };
    expect(
      (await replies(appWith(ours(1, 60_000, false, failing)), 'k', 3)).map((r) => r.status),
    ).toEqual([200, 200, 200]);
  });
});

describe('policyName', () => {
  // express-rate-limit 8's `identifier` (source/parse-options.ts) names these windows so.
  it.each([
    [5, 30_000, '5-in-30sec'],
    [100, 15 * 60_000, '100-in-15min'],
    [5, 60 * 60_000, '5-in-1hr'],
    [5, 2 * 60 * 60_000, '5-in-2hrs'],
    [5, 24 * 60 * 60_000, '5-in-1day'],
  ])('limit %i over %i ms is %s', (limit, windowMs, name) => {
    expect(policyName(limit, windowMs)).toBe(name);
  });
});
