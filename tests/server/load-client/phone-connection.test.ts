/**
 * The load client's own HTTP/1.1 connection (scripts/lib/phone-connection.ts), checked against
 * Node's own HTTP server (node:http, the reference implementation here): replies by length and
 * chunked, compressed ones, the connection kept between requests and opened again after the
 * server closed it, and a reply that never completes given up after the timeout.
 */
import { afterEach, describe, expect, it } from 'vitest';
import http from 'node:http';
import zlib from 'node:zlib';
import type { AddressInfo } from 'node:net';
import { PhoneConnection, dechunk } from '../../../scripts/lib/phone-connection';

type Handler = (req: http.IncomingMessage, body: string, res: http.ServerResponse) => void;
let server: http.Server | null = null;

async function serve(handler: Handler, opts: { keepAliveTimeout?: number } = {}) {
  const seen = {
    connections: 0,
    closed: 0,
    requests: [] as Array<{ headers: http.IncomingHttpHeaders; body: string }>,
  };
  server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', () => {
      const body = Buffer.concat(chunks).toString('utf8');
      seen.requests.push({ headers: req.headers, body });
      handler(req, body, res);
    });
  });
  if (opts.keepAliveTimeout) server.keepAliveTimeout = opts.keepAliveTimeout;
  server.on('connection', (socket) => {
    seen.connections++;
    socket.on('close', () => seen.closed++);
  });
  await new Promise<void>((r) => server!.listen(0, '127.0.0.1', r));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  return { base, seen };
}

afterEach(async () => {
  if (!server) return;
  server.closeAllConnections();
  await new Promise((r) => server!.close(r));
  server = null;
});

const json = (res: http.ServerResponse, status: number, value: unknown) => {
  const text = JSON.stringify(value);
  res.writeHead(status, {
    'content-type': 'application/json',
    'content-length': Buffer.byteLength(text),
  });
  res.end(text);
};

describe('PhoneConnection', () => {
  it('sends each request with its headers and body on one kept connection', async () => {
    const { base, seen } = await serve((_req, body, res) =>
      json(res, 201, { echo: JSON.parse(body) }),
    );
    const phone = new PhoneConnection(base, 5_000);
    const headers = 'Content-Type: application/json\r\nX-Forwarded-For: 10.0.0.7\r\n';
    for (const word of ['één', 'two', 'three']) {
      const reply = await phone.post('/api/r/x/answers', headers, JSON.stringify({ word }));
      expect(reply).toEqual({ status: 201, retryAfter: undefined, json: { echo: { word } } });
    }
    phone.close();
    expect(seen.connections).toBe(1);
    expect(seen.requests.map((r) => JSON.parse(r.body).word)).toEqual(['één', 'two', 'three']);
    expect(seen.requests[0].headers).toMatchObject({
      'x-forwarded-for': '10.0.0.7',
      'content-type': 'application/json',
      connection: 'keep-alive',
    });
  });

  it('reads chunked and compressed replies, and the status and Retry-After of an error', async () => {
    const big = { screens: Array.from({ length: 400 }, (_, i) => ({ key: `task:${i}` })) };
    const { base } = await serve((req, _body, res) => {
      if (req.url === '/chunked') {
        res.writeHead(201, { 'content-type': 'application/json' });
        const text = JSON.stringify(big);
        res.write(text.slice(0, 100));
        setTimeout(() => res.end(text.slice(100)), 20);
      } else if (req.url === '/br' || req.url === '/gzip') {
        const text = Buffer.from(JSON.stringify(big));
        const packed = req.url === '/br' ? zlib.brotliCompressSync(text) : zlib.gzipSync(text);
        res.writeHead(201, {
          'content-encoding': req.url.slice(1),
          'transfer-encoding': 'chunked',
        });
        res.end(packed);
      } else {
        res.setHeader('retry-after', '2');
        json(res, 503, { error: { code: 'unavailable' } });
      }
    });
    const phone = new PhoneConnection(base, 5_000);
    for (const path of ['/chunked', '/br', '/gzip'])
      expect((await phone.post(path, '', '{}')).json).toEqual(big);
    expect(await phone.post('/down', '', '{}')).toEqual({
      status: 503,
      retryAfter: '2',
      json: { error: { code: 'unavailable' } },
    });
    phone.close();
  });

  it('opens the connection again after the server closed it', async () => {
    const { base, seen } = await serve(
      (req, _b, res) => {
        if (req.url === '/last') res.setHeader('connection', 'close');
        json(res, 200, { ok: true });
      },
      { keepAliveTimeout: 50 },
    );
    const phone = new PhoneConnection(base, 5_000);
    await phone.post('/a', '', '{}');
    // The server closes the idle connection (Node adds a margin to keepAliveTimeout).
    while (seen.closed < 1) await new Promise((r) => setTimeout(r, 50));
    await phone.post('/last', '', '{}'); // answered with Connection: close
    expect((await phone.post('/b', '', '{}')).json).toEqual({ ok: true });
    phone.close();
    expect(seen.connections).toBe(3);
  });

  it('gives up a reply that does not complete within the timeout, then works on a new connection', async () => {
    const { base, seen } = await serve((req, _b, res) => {
      if (req.url === '/stuck') {
        res.writeHead(200, { 'content-length': '100' });
        res.write('{"cut');
      } else json(res, 200, { ok: true });
    });
    const phone = new PhoneConnection(base, 200);
    await expect(phone.post('/stuck', '', '{}')).rejects.toThrow('timed out');
    expect((await phone.post('/fine', '', '{}')).json).toEqual({ ok: true });
    phone.close();
    expect(seen.connections).toBe(2);
  });

  it('rejects a 2xx whose body is not JSON (the answer is sent again), not a 4xx', async () => {
    const { base } = await serve((req, _b, res) => {
      res.writeHead(req.url === '/ok' ? 200 : 404, { 'content-length': '5' });
      res.end('<html');
    });
    const phone = new PhoneConnection(base, 5_000);
    await expect(phone.post('/ok', '', '{}')).rejects.toThrow();
    expect(await phone.post('/missing', '', '{}')).toEqual({
      status: 404,
      retryAfter: undefined,
      json: {},
    });
    phone.close();
  });
});

describe('dechunk', () => {
  // RFC 9112, section 7.1: chunk sizes in hex, extensions after ';', a zero chunk and an empty trailer.
  const wire = Buffer.from('HEAD4;ext=1\r\nWiki\r\n5\r\npedia\r\n0\r\n\r\n', 'latin1');
  it('returns the body once the last chunk and the empty trailer line are there', () => {
    expect(dechunk(wire, 4)?.toString()).toBe('Wikipedia');
  });
  it('returns null while any part is missing', () => {
    for (const cut of [6, 15, 22, wire.length - 1])
      expect(dechunk(wire.subarray(0, cut), 4)).toBeNull();
  });
});
