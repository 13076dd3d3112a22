/**
 * The web process's HTTP server settings (server/lib/http-listen.ts): a phone's connection
 * stays open between answers, and the kernel may queue a launch's connections.
 */
import { afterEach, describe, expect, it, vi } from 'vitest';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import {
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
