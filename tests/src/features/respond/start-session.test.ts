// @vitest-environment jsdom
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { prefetchSession, startSessionOnce } from '@/features/respond/api/start-session';

let calls: { url: string; body: { sessionToken?: string } }[];
let failNext: boolean;
beforeEach(() => {
  localStorage.clear();
  calls = [];
  failNext = false;
  vi.stubGlobal('fetch', async (url: string, init?: RequestInit) => {
    const body = JSON.parse(String(init?.body));
    calls.push({ url, body });
    if (failNext) {
      failNext = false;
      return new Response(JSON.stringify({ error: { code: 'x', message: 'busy' } }), {
        status: 503,
        headers: { 'content-type': 'application/json' },
      });
    }
    return new Response(JSON.stringify({ sessionToken: `T${calls.length}`.padEnd(32, 'x') }), {
      status: 201,
      headers: { 'content-type': 'application/json' },
    });
  });
});
afterEach(() => vi.unstubAllGlobals());

describe('starting a respondent session', () => {
  it('gives the app the early start even when it arrived before the app loaded', async () => {
    const early = await prefetchSession('link1', '?pid=7');
    const app = await startSessionOnce('link1', '?pid=7');
    expect(app).toBe(early);
    expect(calls).toHaveLength(1);
    // Claimed once: a later start is a new request that resumes the stored session.
    await startSessionOnce('link1', '?pid=7');
    expect(calls).toHaveLength(2);
    expect(calls[1].body.sessionToken).toBe(early.sessionToken);
  });

  it('shares one request among starts made while it is on its way', async () => {
    const [a, b, c] = await Promise.all([
      prefetchSession('link2', ''),
      startSessionOnce('link2', ''),
      startSessionOnce('link2', ''),
    ]);
    expect(a).toBe(b);
    expect(b).toBe(c);
    expect(calls).toHaveLength(1);
  });

  it('never hands the app a failed early start: the app asks again', async () => {
    failNext = true;
    await expect(prefetchSession('link3', '')).rejects.toBeTruthy();
    const session = await startSessionOnce('link3', '');
    expect(calls).toHaveLength(2);
    expect(session.sessionToken).toMatch(/^T2/);
  });
});
