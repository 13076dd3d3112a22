/**
 * The answer lane (server/middleware/answer-lane.ts): an answer that skips the routers gets
 * what it would get through them — the same reply, headers, refusals and rate-limit count.
 * A path the lane does not take (a trailing slash) still reaches the same route the long way.
 */
import { describe, expect, it, vi } from 'vitest';
import type { Request, Response } from 'express';
import { useTestApp } from '../../support/test-app';
import { answerFor, startLiveSession, type LiveSession } from '../routes/respond-fixtures';
import express from 'express';
import supertest from 'supertest';
import { answerLane, enterAnswersFirst } from '../../../server/middleware/answer-lane';

const SESSION_LIMIT = 6;
const t = useTestApp({ RESPONDENT_SESSION_RATE_LIMIT: String(SESSION_LIMIT) }, { signIn: 'owner' });

const post = (path: string, token: string, body: object) =>
  t.request().post(path).set('x-respondent-token', token).send(body);

async function live(): Promise<{ publicId: string; session: LiveSession }> {
  const { study, session } = await startLiveSession(t, t.owner, t.teamId);
  return { publicId: study.publicId, session };
}

/**
 * Headers a reply must carry whichever way it came: values that vary per reply are left out,
 * and so is Vary, which the compression step adds on the long way only (server/app.ts).
 */
function stableHeaders(res: { headers: Record<string, string> }) {
  const { date, 'content-length': _l, ratelimit: _r, vary: _v, ...rest } = res.headers;
  expect(date).toBeDefined();
  return rest;
}

describe('POST /api/r/:publicId/answers through the lane', () => {
  it('answers with the same status, body and headers as the routers do', async () => {
    const { publicId, session } = await live();
    const [first, second] = session.screens;
    const viaLane = await post(
      `/api/r/${publicId}/answers`,
      session.sessionToken,
      answerFor(first),
    ).expect(201);
    // A trailing slash is not the lane's path: Express routes it to the same handler.
    const viaRouters = await post(
      `/api/r/${publicId}/answers/`,
      session.sessionToken,
      answerFor(second),
    ).expect(201);
    expect(viaLane.body.screenKey).toBe(first.key);
    expect(viaLane.body.nextScreenKey).toBe(second.key);
    expect(stableHeaders(viaLane)).toEqual(stableHeaders(viaRouters));
    // Nor is a query string: the routers store it all the same.
    const withQuery = await post(
      `/api/r/${publicId}/answers?from=panel`,
      session.sessionToken,
      answerFor(session.screens[2]),
    ).expect(201);
    expect(stableHeaders(withQuery)).toEqual(stableHeaders(viaLane));
    expect(viaLane.headers['cache-control']).toBe('no-store');
    expect(viaLane.headers['content-type']).toBe('application/json; charset=utf-8');
    expect(viaLane.headers['x-content-type-options']).toBe('nosniff');
    expect(viaLane.headers['ratelimit-policy']).toBeDefined();
    // A receipt is never cached or revalidated: no ETag is computed for it.
    expect(viaLane.headers.etag).toBeUndefined();
  });

  it('refuses a cross-site answer with 403 and stores nothing', async () => {
    const { publicId, session } = await live();
    const res = await post(
      `/api/r/${publicId}/answers`,
      session.sessionToken,
      answerFor(session.screens[0]),
    )
      .set('Origin', 'https://elsewhere.example')
      .expect(403);
    expect(res.body.error.code).toBe('cross_site_request');
    // The screen is still unanswered: the same answer is now stored.
    await post(
      `/api/r/${publicId}/answers`,
      session.sessionToken,
      answerFor(session.screens[0]),
    ).expect(201);
  });

  it('answers malformed JSON with 400 malformed_json, in the one error shape', async () => {
    const { publicId, session } = await live();
    const res = await t
      .request()
      .post(`/api/r/${publicId}/answers`)
      .set('x-respondent-token', session.sessionToken)
      .set('content-type', 'application/json')
      .send('{"clientId": ')
      .expect(400);
    expect(res.body).toEqual({
      error: { code: 'malformed_json', message: 'The request body is not valid JSON.' },
    });
  });

  it('counts a session once whichever way its requests come', async () => {
    const { publicId, session } = await live();
    const statuses: number[] = [];
    for (let i = 0; i <= SESSION_LIMIT; i++) {
      const res =
        i % 2 === 0
          ? await post(`/api/r/${publicId}/answers`, session.sessionToken, {})
          : await t
              .request()
              .get(`/api/r/${publicId}/session`)
              .set('x-respondent-token', session.sessionToken);
      statuses.push(res.status);
    }
    expect(statuses.slice(0, SESSION_LIMIT).every((s) => s !== 429)).toBe(true);
    expect(statuses[SESSION_LIMIT]).toBe(429);
  });
});

describe('answerLane', () => {
  const res = () => ({ headersSent: false }) as unknown as Response;
  const req = (method: string, path: string) =>
    ({ method, path, socket: { destroy: vi.fn() } }) as unknown as Request;

  it('leaves other methods and paths to the routers', () => {
    const step = vi.fn();
    const lane = answerLane({ common: [], answers: [step], revisions: [step] }, vi.fn());
    for (const [method, path] of [
      ['GET', '/api/r/abc/answers'],
      ['POST', '/api/r/abc/answers/'],
      ['POST', '/api/r/abc/sessions'],
      ['POST', '/api/r/a/b/answers'],
      ['POST', '/api/r/%E0%A4%A/answers'],
    ]) {
      const next = vi.fn();
      lane(req(method, path), res(), next);
      expect(next).toHaveBeenCalledOnce();
    }
    expect(step).not.toHaveBeenCalled();
  });

  it('runs the steps in order with the decoded public id, and hands a rejection to the error handler', async () => {
    const seen: string[] = [];
    const failure = new Error('stored nowhere');
    const onError = vi.fn();
    const lane = answerLane(
      {
        common: [(_q, _s, next) => (seen.push('common'), next())],
        answers: [],
        revisions: [
          (q, _s, next) => (seen.push(`revisions ${q.params.publicId}`), next()),
          async () => {
            throw failure;
          },
        ],
      },
      onError,
    );
    const r = req('POST', '/api/r/a%20b/revisions');
    lane(r, res(), vi.fn());
    await vi.waitFor(() => expect(onError).toHaveBeenCalledOnce());
    expect(seen).toEqual(['common', 'revisions a b']);
    expect(onError.mock.calls[0][0]).toBe(failure);
  });
});

describe('enterAnswersFirst', () => {
  /** An app whose router records every request it walks, with the lane entered first. */
  function appWithEntrance() {
    const walked: string[] = [];
    const app = express();
    app.disable('x-powered-by');
    const reply: express.RequestHandler = (req, res) => {
      res.json({ publicId: req.params.publicId, app: req.app === app, url: req.originalUrl });
    };
    const lane = answerLane({ common: [], answers: [reply], revisions: [reply] }, vi.fn());
    enterAnswersFirst(app, lane);
    app.use((req, _res, next) => (walked.push(`${req.method} ${req.url}`), next()));
    app.use(lane);
    app.use((_req, res) => {
      res.status(404).json({ routed: true });
    });
    return { app, walked };
  }

  it('takes an answer past the router, with the request prepared as Express prepares it', async () => {
    const { app, walked } = appWithEntrance();
    const res = await supertest(app).post('/api/r/a%20b/answers').send({}).expect(200);
    expect(res.body).toEqual({ publicId: 'a b', app: true, url: '/api/r/a%20b/answers' });
    expect(walked).toEqual([]);
  });

  it('leaves anything else to the router, a query string and a malformed escape included', async () => {
    const { app, walked } = appWithEntrance();
    await supertest(app).post('/api/r/abc/answers?x=1').send({}).expect(200);
    await supertest(app).get('/api/r/abc/answers').expect(404);
    await supertest(app).post('/api/r/%E0%A4%A/answers').send({}).expect(404);
    expect(walked).toEqual([
      'POST /api/r/abc/answers?x=1',
      'GET /api/r/abc/answers',
      'POST /api/r/%E0%A4%A/answers',
    ]);
  });
});
