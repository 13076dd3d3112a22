/**
 * The built client as production serves it: compressed, hashed assets cached as immutable,
 * pages revalidated, respondent links on their own lean page.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import express from 'express';
import compression from 'compression';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { serveClient } from '../../server/static-client';

let dir: string;
let request: supertest.Agent;
const bigScript = `export const words = ${JSON.stringify('choice '.repeat(4000))};\n`;

beforeAll(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-client-'));
  fs.mkdirSync(path.join(dir, 'assets'));
  fs.writeFileSync(path.join(dir, 'index.html'), '<!doctype html><title>researcher</title>');
  fs.writeFileSync(path.join(dir, 'respond.html'), '<!doctype html><title>respondent</title>');
  fs.writeFileSync(path.join(dir, 'assets', 'app-Ab12Cd34.js'), bigScript);
  fs.writeFileSync(path.join(dir, 'favicon.svg'), '<svg xmlns="http://www.w3.org/2000/svg"/>');
  const app = express();
  app.use(compression());
  serveClient(app, dir);
  request = supertest.agent(app);
});
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

describe('serveClient', () => {
  it('caches hashed assets for a year as immutable', async () => {
    const res = await request.get('/assets/app-Ab12Cd34.js').expect(200);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
  });

  it('compresses scripts with brotli or gzip, as the browser asks', async () => {
    const br = await request
      .get('/assets/app-Ab12Cd34.js')
      .set('Accept-Encoding', 'br')
      .buffer(true)
      .parse((res, cb) => {
        res.on('data', () => {});
        res.on('end', () => cb(null, null));
      })
      .expect(200);
    expect(br.headers['content-encoding']).toBe('br');
    const gz = await request.get('/assets/app-Ab12Cd34.js').set('Accept-Encoding', 'gzip');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gz.text).toBe(bigScript);
  });

  it('answers an unknown asset with 404 instead of a page', async () => {
    await request.get('/assets/gone-00000000.js').expect(404);
  });

  it('serves the respondent page for a survey link and revalidates it', async () => {
    const res = await request.get('/s/AbCdEf123456').expect(200);
    expect(res.text).toContain('respondent');
    expect(res.headers['cache-control']).toBe('no-cache');
  });

  it('serves the researcher app for every other path, revalidated', async () => {
    const res = await request.get('/teams/x/studies').expect(200);
    expect(res.text).toContain('researcher');
    expect(res.headers['cache-control']).toBe('no-cache');
  });
});
