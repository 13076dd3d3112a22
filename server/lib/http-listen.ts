/**
 * The web process's HTTP server: how long it keeps a phone's connection open and how many
 * new connections the kernel may hold for it.
 *
 * Under a panel launch the event loop is busy with answers, and Node accepts one new
 * connection per turn of the loop (measured with Node 20: 19 accepts in 20 turns of 100 ms
 * each while 200 connections waited). The kernel holds the others in the listening socket's
 * accept queue; once that is full it drops new connection attempts, and a phone's browser
 * tries again only 1 s later, then 2 s after that (TCP's SYN retransmission: initial
 * timeout of 1 s, doubled each time; RFC 6298, section 2). So:
 * - keep each phone's connection open between answers: Node's default of 5 s closes it while
 *   a respondent is still reading a choice task, and every next answer then needs a new
 *   connection and waits for an accept;
 * - let the kernel queue more connections than Node's default backlog of 511 (the kernel caps
 *   it at net.core.somaxconn), so a launch waits in the queue instead of being dropped.
 */
import http from 'node:http';
import type { RequestListener } from 'node:http';

/** Longer than the 60 s idle timeout common to load balancers (common practice, no source), so the balancer, not Node, closes an idle upstream connection. */
export const KEEP_ALIVE_TIMEOUT_MS = 65_000;
/** Node requires headersTimeout above keepAliveTimeout, or a reused connection can be cut mid-request. */
export const HEADERS_TIMEOUT_MS = KEEP_ALIVE_TIMEOUT_MS + 1_000;
/** Connections the kernel may queue before Node accepts them (capped by net.core.somaxconn). */
export const LISTEN_BACKLOG = 4_096;

export function createHttpServer(app: RequestListener): http.Server {
  const server = http.createServer(app);
  server.keepAliveTimeout = KEEP_ALIVE_TIMEOUT_MS;
  server.headersTimeout = HEADERS_TIMEOUT_MS;
  return server;
}

/** Listens with the backlog above; resolves once listening. */
export function listenHttp(
  server: http.Server,
  opts: { port: number; host: string },
): Promise<http.Server> {
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen({ port: opts.port, host: opts.host, backlog: LISTEN_BACKLOG }, () => {
      server.off('error', reject);
      resolve(server);
    });
  });
}

/** How long a stopping web process lets requests in flight finish before it cuts them off. */
export const SHUTDOWN_GRACE_MS = 10_000;

/**
 * Stops taking connections, closes idle ones, and resolves once the requests in flight have
 * been answered (or after `graceMs`, when what is left is cut off). The shutdown ends the
 * database pool only after this: ending it first answered requests in flight with 500, and an
 * answer the server had started to store could come back as an error to the phone.
 */
export function closeHttp(server: http.Server, graceMs = SHUTDOWN_GRACE_MS): Promise<void> {
  return new Promise((resolve) => {
    const cutOff = setTimeout(() => server.closeAllConnections(), graceMs);
    // A keep-alive connection whose request is answered after close() stays open until the
    // client drops it (Node 20 closes only the connections idle at the call), so look again.
    const sweep = setInterval(() => server.closeIdleConnections(), 50);
    server.close(() => {
      clearTimeout(cutOff);
      clearInterval(sweep);
      resolve();
    });
    server.closeIdleConnections();
  });
}
