/**
 * The respondent access log's line and the logger a handler gets from `req.log`: a failed
 * respondent request is logged with its id, method, route pattern, status and duration, a
 * handler's own line carries the same request fields (the child logger made on first use),
 * and a request cut off before its reply is still logged once.
 */
import { describe, expect, it } from 'vitest';
import express from 'express';
import supertest from 'supertest';
import { Writable } from 'node:stream';
import { createLogger } from '../../../server/lib/logger';
import { createRequestLog } from '../../../server/lib/request-log';

function setUp() {
  const lines: Array<Record<string, unknown>> = [];
  const sink = new Writable({
    write(chunk, _enc, done) {
      lines.push(JSON.parse(String(chunk)) as Record<string, unknown>);
      done();
    },
  });
  const app = express();
  app.use(createRequestLog(createLogger('info', sink), () => '/api/r/:publicId/answers'));
  app.post('/api/r/:publicId/answers', (req, res) => {
    req.log.warn({ code: 'EXAMPLE' }, 'handler line');
    res.status(503).json({ error: 'unavailable' });
  });
  app.post('/api/r/:publicId/revisions', (_req, res) => {
    res.socket?.destroy();
  });
  return { app, lines };
}

const settle = () => new Promise((r) => setTimeout(r, 20));

describe('the respondent access log', () => {
  it('when a handler logs and the request fails, both lines carry the request fields', async () => {
    const { app, lines } = setUp();
    await supertest(app).post('/api/r/AbCdEfGh12/answers').send({}).expect(503);
    await settle();
    const handler = lines.find((l) => l.msg === 'handler line');
    const access = lines.find((l) => l.msg === 'POST /api/r/:publicId/answers 503');
    const req = { id: expect.any(Number), method: 'POST', route: '/api/r/:publicId/answers' };
    expect(handler).toMatchObject({ level: 40, code: 'EXAMPLE', req });
    expect(access).toMatchObject({ level: 50, req, res: { statusCode: 503 } });
    expect(access?.responseTime).toEqual(expect.any(Number));
    expect(access).not.toHaveProperty('sampledOneIn');
    expect(lines).toHaveLength(2);
  });

  it('when the connection is cut before a reply, logs the request once', async () => {
    const { app, lines } = setUp();
    await supertest(app)
      .post('/api/r/AbCdEfGh12/revisions')
      .send({})
      .catch(() => {});
    await settle();
    expect(lines.filter((l) => String(l.msg).startsWith('POST /api/r/'))).toHaveLength(1);
  });
});
