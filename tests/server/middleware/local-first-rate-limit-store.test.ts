/**
 * The local count in front of the shared rate-limit counters: a process alone refuses exactly
 * at the limit, several processes at the latest after limit + (k − 1) × budget hits, nothing
 * is written while a key stays within its budget, and keys never share a count.
 */
import { describe, expect, it } from 'vitest';
import type { IncrementResponse, Options } from 'express-rate-limit';
import {
  LocalFirstRateLimitStore,
  type SharedCounters,
} from '../../../server/middleware/local-first-rate-limit-store';

const WINDOW = 60_000;

/** The shared counters in memory: exact counts per key and window, and a log of every write. */
function sharedCounters(clock: { now: number }) {
  const counts = new Map<string, { hits: number; resetAt: number }>();
  const writes: Array<{ key: string; hits: number }> = [];
  let failing = false;
  const store: SharedCounters & { writes: typeof writes; fail(on: boolean): void } = {
    prefix: 'test',
    localKeys: false,
    writes,
    fail: (on) => {
      failing = on;
    },
    init: () => {},
    async increment(key: string, hits: number = 1): Promise<IncrementResponse> {
      if (failing) throw new Error('database unreachable');
      writes.push({ key, hits });
      let c = counts.get(key);
      if (!c || c.resetAt <= clock.now) c = { hits: 0, resetAt: clock.now + WINDOW };
      c.hits += hits;
      counts.set(key, c);
      return { totalHits: c.hits, resetTime: new Date(c.resetAt) };
    },
    async get(key: string) {
      const c = counts.get(key);
      return c ? { totalHits: c.hits, resetTime: new Date(c.resetAt) } : undefined;
    },
    async decrement(key: string) {
      const c = counts.get(key);
      if (c) c.hits--;
    },
    async resetKey(key: string) {
      counts.delete(key);
    },
  };
  return store;
}

function localStore(shared: SharedCounters, clock: { now: number }, limit: number, share = 0.25) {
  const store = new LocalFirstRateLimitStore(shared, share, () => clock.now);
  store.init({ limit, windowMs: WINDOW } as Options);
  return store;
}

/** Hits the key on the stores in turn until one is refused; returns how many were allowed. */
async function allowedUntilRefused(stores: LocalFirstRateLimitStore[], key: string, limit: number) {
  for (let n = 0; n < 10 * limit; n++) {
    const res = await stores[n % stores.length].increment(key);
    if (res.totalHits > limit) return n;
  }
  throw new Error('never refused');
}

describe('LocalFirstRateLimitStore', () => {
  it('alone, refuses exactly at the limit and writes nothing while the key is within its budget', async () => {
    const clock = { now: 1_000 };
    const shared = sharedCounters(clock);
    const store = localStore(shared, clock, 20);
    for (let i = 0; i < 5; i++) await store.increment('session:a');
    expect(shared.writes).toEqual([]);
    expect(await allowedUntilRefused([store], 'session:a', 20)).toBe(15);
    // The first write carried the five hits counted here plus its own.
    expect(shared.writes[0]).toEqual({ key: 'session:a', hits: 6 });
  });

  it('on two processes sharing the counters, refuses at the latest after limit + budget hits', async () => {
    const clock = { now: 1_000 };
    const shared = sharedCounters(clock);
    const stores = [localStore(shared, clock, 40), localStore(shared, clock, 40)];
    const allowed = await allowedUntilRefused(stores, 'ip:10.0.0.1', 40);
    expect(allowed).toBeGreaterThanOrEqual(40);
    expect(allowed).toBeLessThanOrEqual(40 + 10);
    // Once refused, every further hit is refused on both processes.
    for (const s of stores)
      expect((await s.increment('ip:10.0.0.1')).totalHits).toBeGreaterThan(40);
  });

  it('counts every key apart: one key over its limit does not refuse another', async () => {
    const clock = { now: 1_000 };
    const shared = sharedCounters(clock);
    const store = localStore(shared, clock, 8);
    await allowedUntilRefused([store], 'session:noisy', 8);
    expect((await store.increment('session:calm')).totalHits).toBe(1);
  });

  it('starts a new count when the window ends', async () => {
    const clock = { now: 1_000 };
    const shared = sharedCounters(clock);
    const store = localStore(shared, clock, 8);
    await allowedUntilRefused([store], 'session:a', 8);
    clock.now += WINDOW + 1;
    expect((await store.increment('session:a')).totalHits).toBe(1);
  });

  it('keeps hits it could not write, so the next write carries them', async () => {
    const clock = { now: 1_000 };
    const shared = sharedCounters(clock);
    const store = localStore(shared, clock, 8);
    for (let i = 0; i < 2; i++) await store.increment('k');
    shared.fail(true);
    await expect(store.increment('k')).rejects.toThrow('database unreachable');
    shared.fail(false);
    expect(await store.increment('k')).toMatchObject({ totalHits: 4 });
    expect(shared.writes).toEqual([{ key: 'k', hits: 4 }]);
  });

  it('takes back a hit counted here before touching the shared count', async () => {
    const clock = { now: 1_000 };
    const shared = sharedCounters(clock);
    const store = localStore(shared, clock, 8);
    await store.increment('k');
    await store.decrement('k');
    expect(await store.get('k')).toMatchObject({ totalHits: 0 });
    expect(shared.writes).toEqual([]);
  });

  it('with no local share, writes every hit through (sign-in and account limits)', async () => {
    const clock = { now: 1_000 };
    const shared = sharedCounters(clock);
    const store = localStore(shared, clock, 8, 0);
    await store.increment('k');
    expect(shared.writes).toEqual([{ key: 'k', hits: 1 }]);
  });
});
