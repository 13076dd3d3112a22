/**
 * A TCP proxy in front of PostgreSQL that the fault tests control: `cut()` closes every
 * connection at once, as a PostgreSQL restart does to its clients; `refuse()` turns new
 * connections away until `resume()`, as a server that is down or still starting does. The
 * shared cluster itself is never touched.
 */
import net from 'node:net';

export type TcpProxy = {
  port: number;
  /** Connections currently open through the proxy. */
  readonly open: number;
  cut(): void;
  refuse(): void;
  resume(): void;
  close(): Promise<void>;
};

export async function startTcpProxy(target: { host: string; port: number }): Promise<TcpProxy> {
  const sockets = new Set<net.Socket>();
  let refusing = false;
  const server = net.createServer((client) => {
    if (refusing) {
      client.destroy();
      return;
    }
    const upstream = net.connect(target.port, target.host);
    sockets.add(client).add(upstream);
    const drop = () => {
      client.destroy();
      upstream.destroy();
      sockets.delete(client);
      sockets.delete(upstream);
    };
    client.on('error', drop).on('close', drop);
    upstream.on('error', drop).on('close', drop);
    client.pipe(upstream).pipe(client);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const port = (server.address() as net.AddressInfo).port;
  const cut = () => {
    for (const s of sockets) s.destroy();
    sockets.clear();
  };
  return {
    port,
    get open() {
      return sockets.size / 2;
    },
    cut,
    refuse: () => {
      refusing = true;
      cut();
    },
    resume: () => {
      refusing = false;
    },
    close: () => {
      cut();
      return new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}

/** The same URL with host and port replaced by the proxy's. */
export function throughProxy(url: string, proxy: TcpProxy): string {
  const u = new URL(url);
  u.hostname = '127.0.0.1';
  u.port = String(proxy.port);
  return u.toString();
}
