/**
 * The respondent JSON parser against its reference, express.json() (body-parser 2): for the
 * plain bodies it reads itself and for every other kind it hands on, the same request gives
 * the same status and the same parsed body (or the same error reply) as body-parser alone.
 */
import { describe, expect, it } from 'vitest';
import express, { type RequestHandler } from 'express';
import supertest from 'supertest';
import { gzipSync } from 'node:zlib';
import { createRespondentJson } from '../../../server/middleware/respondent-json';
import { errorHandler } from '../../../server/middleware/error-handler';

const LIMIT = 1024;

function appWith(parser: RequestHandler) {
  const app = express();
  app.post('/', parser, (req, res) => {
    res.json({ body: req.body === undefined ? '(undefined)' : req.body });
  });
  app.use(errorHandler);
  return app;
}

const reference = appWith(express.json({ limit: LIMIT }));
const ours = appWith(createRespondentJson(LIMIT));

type Case = { name: string; body: string | Buffer; headers: Record<string, string> };
const json = { 'Content-Type': 'application/json' };

const cases: Case[] = [
  { name: 'an object', body: '{"screenKey":"t1","value":{"choice":2}}', headers: json },
  { name: 'an array', body: '[1,2,3]', headers: json },
  { name: 'whitespace before the object', body: ' \n\t{"a":1}', headers: json },
  { name: 'a byte-order mark', body: '\ufeff{"a":"é"}', headers: json },
  { name: 'multi-byte text', body: '{"text":"Wasser – ναι – 水"}', headers: json },
  { name: 'a bare string (strict mode)', body: '"just text"', headers: json },
  { name: 'a bare number', body: '42', headers: json },
  { name: 'malformed JSON', body: '{"a":', headers: json },
  { name: 'only whitespace', body: '   ', headers: json },
  {
    name: 'charset utf-8',
    body: '{"a":1}',
    headers: { 'Content-Type': 'application/json; charset=utf-8' },
  },
  {
    name: 'upper-case type',
    body: '{"a":1}',
    headers: { 'Content-Type': 'Application/JSON; Charset=UTF-8' },
  },
  {
    name: 'an unsupported charset',
    body: '{"a":1}',
    headers: { 'Content-Type': 'application/json; charset=latin1' },
  },
  { name: 'another media type', body: '{"a":1}', headers: { 'Content-Type': 'text/plain' } },
  {
    name: 'a gzip body',
    body: gzipSync('{"a":1}'),
    headers: { ...json, 'Content-Encoding': 'gzip' },
  },
  { name: 'a body over the limit', body: `{"a":"${'x'.repeat(LIMIT)}"}`, headers: json },
  { name: 'a body exactly at the limit', body: `{"a":"${'x'.repeat(LIMIT - 8)}"}`, headers: json },
  { name: 'an empty body', body: '', headers: json },
];

describe('createRespondentJson', () => {
  it.each(cases)('with $name, answers as express.json() does', async ({ body, headers }) => {
    const send = (app: express.Express) => supertest(app).post('/').set(headers).send(body);
    const [theirs, mine] = await Promise.all([send(reference), send(ours)]);
    expect({ status: mine.status, body: mine.body }).toEqual({
      status: theirs.status,
      body: theirs.body,
    });
  });

  it('when the body is over the limit, answers 413 too_large', async () => {
    const res = await supertest(ours)
      .post('/')
      .set(json)
      .send(`{"a":"${'x'.repeat(LIMIT)}"}`);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_large');
  });

  it('when the body is chunked (no Content-Length), parses it as express.json() does', async () => {
    const send = (app: express.Express) => {
      const req = supertest(app).post('/').set(json);
      req.write('{"a":');
      req.write('[1,2]}');
      return req;
    };
    const [theirs, mine] = await Promise.all([send(reference), send(ours)]);
    expect(mine.body).toEqual(theirs.body);
    expect(mine.body).toEqual({ body: { a: [1, 2] } });
  });
});
