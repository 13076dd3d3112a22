/**
 * The web process's HTTP server settings (server/lib/http-listen.ts): a phone's connection
 * stays open between answers, the kernel may queue a launch's connections, and a stopping
 * process answers the requests in flight before the database pool closes.
 */
import { afterEach, describe, expect, it, vi } from 'vitest';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import {
  closeHttp,
  createHttpServer,
  HEADERS_TIMEOUT_MS,
  KEEP_ALIVE_TIMEOUT_MS,
  LISTEN_BACKLOG,
  listenHttp,
} from '../../../server/lib/http-listen';

let server: http.Server | null = null;
afterEach(async () => {
  server?.closeAllConnections();
  await new Promise((r) => server?.close(r) ?? r(null));
  server = null;
});

describe('createHttpServer', () => {
  it('keeps idle connections longer than a load balancer’s 60 s, headers timeout above it', () => {
    server = createHttpServer((_req, res) => res.end());
    expect(server.keepAliveTimeout).toBe(KEEP_ALIVE_TIMEOUT_MS);
    expect(KEEP_ALIVE_TIMEOUT_MS).toBeGreaterThan(60_000);
    expect(server.headersTimeout).toBe(HEADERS_TIMEOUT_MS);
    expect(server.headersTimeout).toBeGreaterThan(server.keepAliveTimeout);
  });

  it('serves a phone’s successive requests on one connection, announcing the keep-alive time', async () => {
    server = createHttpServer((_req, res) => res.end('ok'));
    let connections = 0;
    server.on('connection', () => connections++);
    await listenHttp(server, { port: 0, host: '127.0.0.1' });
    const { port } = server.address() as AddressInfo;
    const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
    const get = () =>
      new Promise<http.IncomingMessage>((resolve, reject) =>
        http
          .get({ host: '127.0.0.1', port, agent }, (res) => {
            res.resume();
            res.on('end', () => resolve(res));
          })
          .on('error', reject),
      );
    try {
      const first = await get();
      await get();
      await get();
      expect(connections).toBe(1);
      expect(first.headers['keep-alive']).toBe(`timeout=${KEEP_ALIVE_TIMEOUT_MS / 1000}`);
    } finally {
      agent.destroy();
    }
  });
});

describe('listenHttp', () => {
  it('asks the kernel for a longer accept queue than Node’s default of 511', async () => {
    server = createHttpServer((_req, res) => res.end());
    const listen = vi.spyOn(server, 'listen');
    await listenHttp(server, { port: 0, host: '127.0.0.1' });
    expect(listen.mock.calls[0][0]).toMatchObject({ backlog: LISTEN_BACKLOG });
    expect(LISTEN_BACKLOG).toBeGreaterThan(511);
  });

  it('when the port is taken, rejects', async () => {
    server = createHttpServer((_req, res) => res.end());
    await listenHttp(server, { port: 0, host: '127.0.0.1' });
    const { port } = server.address() as AddressInfo;
    const other = createHttpServer((_req, res) => res.end());
    await expect(listenHttp(other, { port, host: '127.0.0.1' })).rejects.toThrow(/EADDRINUSE/);
  });
});

describe('closeHttp', () => {
  /** A server whose handler answers when `release` is called; resolves once it listens. */
  async function slowServer() {
    let release = () => {};
    const arrived = new Promise<void>((onArrive) => {
      server = createHttpServer((_req, res) => {
        release = () => res.end('stored');
        onArrive();
      });
    });
    await listenHttp(server!, { port: 0, host: '127.0.0.1' });
    const { port } = server!.address() as AddressInfo;
    return { port, arrived, release: () => release() };
  }
  const request = (port: number, agent?: http.Agent) =>
    new Promise<{ status: number; body: string }>((resolve, reject) =>
      http
        .get({ host: '127.0.0.1', port, agent }, (res) => {
          let body = '';
          res.on('data', (c) => (body += c));
          res.on('end', () => resolve({ status: res.statusCode ?? 0, body }));
        })
        .on('error', reject),
    );

  it('answers a request in flight, and resolves only after it', async () => {
    const { port, arrived, release } = await slowServer();
    // A phone's browser keeps the connection after the reply; only the server closing it once
    // it is idle lets the shutdown go on (the grace period is a minute).
    const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
    try {
      const reply = request(port, agent);
      await arrived;
      let closed = false;
      const closing = closeHttp(server!, 60_000).then(() => (closed = true));
      await new Promise((r) => setTimeout(r, 50));
      expect(closed).toBe(false);
      release();
      expect(await reply).toEqual({ status: 200, body: 'stored' });
      await closing;
      expect(closed).toBe(true);
    } finally {
      agent.destroy();
    }
  });

  it('is not held up by a phone’s idle keep-alive connection', async () => {
    server = createHttpServer((_req, res) => res.end('ok'));
    await listenHttp(server, { port: 0, host: '127.0.0.1' });
    const { port } = server.address() as AddressInfo;
    const agent = new http.Agent({ keepAlive: true, maxSockets: 1 });
    try {
      await request(port, agent);
      // With a grace of a minute, only closing the idle connection lets this resolve in time.
      await closeHttp(server, 60_000);
    } finally {
      agent.destroy();
    }
  });

  it('cuts off a request still unanswered after the grace period', async () => {
    const { port, arrived } = await slowServer();
    const reply = request(port);
    await arrived;
    await closeHttp(server!, 100);
    await expect(reply).rejects.toThrow(/socket hang up|ECONNRESET/);
  });
});
