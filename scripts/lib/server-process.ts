/**
 * Starts Choicewright's processes the way they are deployed (`node --import tsx
 * server/main.ts` or `server/worker.ts`, configured only by environment variables), in their
 * own process groups, with their output in a log file, for benchmarks that measure them from
 * the outside and kill them on purpose.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { processBundleOf } from '../build-process-bundles';

const root = path.resolve(import.meta.dirname, '../..');

export type ServerProcess = {
  readonly pid: number;
  readonly child: ChildProcess;
  /** Resolves when the process has exited. */
  exited: Promise<number | null>;
  /** SIGTERM (graceful), then SIGKILL after `graceMs`. */
  stop(graceMs?: number): Promise<void>;
  /** SIGKILL at once, as a crash or an out-of-memory kill would. */
  kill(): Promise<void>;
};

/**
 * The environment of a production server on 127.0.0.1:`port` that a benchmark starts: its own
 * database and data folder, a fresh JWT secret; mail and the rest are the caller's to add.
 */
export function benchServerEnv(opts: {
  port: number;
  /** The address links and the same-origin check name; http://127.0.0.1:`port` by default. */
  appUrl?: string;
  databaseUrl: string;
  dataDir: string;
  embeddedWorker: boolean;
}): Record<string, string> {
  return {
    NODE_ENV: 'production',
    HOST: '127.0.0.1',
    PORT: String(opts.port),
    APP_URL: opts.appUrl ?? `http://127.0.0.1:${opts.port}`,
    DATABASE_URL: opts.databaseUrl,
    JWT_SECRET: randomBytes(32).toString('hex'),
    DATA_DIR: opts.dataDir,
    EMBEDDED_WORKER: String(opts.embeddedWorker),
  };
}

export function startProcess(opts: {
  entry: 'server/main.ts' | 'server/worker.ts';
  env: Record<string, string>;
  logFile: string;
  /** Another checkout of the project to run (benchmarks comparing two implementations). */
  cwd?: string;
}): ServerProcess {
  fs.mkdirSync(path.dirname(opts.logFile), { recursive: true });
  const log = fs.openSync(opts.logFile, 'a');
  // Profiling a benchmarked server: BENCH_SERVER_NODE_ARGS='--cpu-prof --cpu-prof-dir=…'.
  const nodeArgs = process.env.BENCH_SERVER_NODE_ARGS?.split(' ').filter(Boolean) ?? [];
  // Trying a setting under the same load: BENCH_SERVER_ENV='WORKER_THREADS=1 …' is added to
  // (and overrides) what the benchmark gives its server, as the deployment's environment would.
  const extraEnv = Object.fromEntries(
    (process.env.BENCH_SERVER_ENV?.split(' ').filter(Boolean) ?? []).map((pair) => {
      const at = pair.indexOf('=');
      if (at <= 0) throw new Error(`BENCH_SERVER_ENV: "${pair}" is not NAME=value`);
      return [pair.slice(0, at), pair.slice(at + 1)];
    }),
  );
  // The tests (CW_PROCESS_BUNDLES=use, set by scripts/test.sh) start this checkout's processes
  // from their prebuilt bundles while up to date; benchmarks start them as deployed.
  const bundle = opts.cwd ? null : processBundleOf(opts.entry);
  const start = bundle ? [bundle] : ['--import', 'tsx', opts.entry];
  const child = spawn(process.execPath, [...nodeArgs, ...start], {
    cwd: opts.cwd ?? root,
    env: { PATH: process.env.PATH ?? '', HOME: process.env.HOME ?? '', ...opts.env, ...extraEnv },
    // The IPC channel lets the benchmark ask the server for its event-loop delay
    // (server/lib/event-loop-delay.ts).
    stdio: ['ignore', log, log, 'ipc'],
  });
  fs.closeSync(log);
  const exited = new Promise<number | null>((resolve) =>
    child.once('exit', (code) => resolve(code)),
  );
  return {
    pid: child.pid!,
    child,
    exited,
    async stop(graceMs = 15_000) {
      if (child.exitCode !== null || child.signalCode !== null) return;
      child.kill('SIGTERM');
      const timer = setTimeout(() => child.kill('SIGKILL'), graceMs);
      await exited;
      clearTimeout(timer);
    },
    async kill() {
      if (child.exitCode !== null || child.signalCode !== null) return;
      child.kill('SIGKILL');
      await exited;
    },
  };
}

/** Waits until GET /api/health answers 200 (the database is reachable too). */
export async function waitForHealth(base: string, timeoutMs = 180_000): Promise<number> {
  const started = performance.now();
  for (;;) {
    try {
      const res = await fetch(`${base}/api/health`, { signal: AbortSignal.timeout(2_000) });
      if (res.ok) return (performance.now() - started) / 1000;
    } catch {
      // not listening yet
    }
    if (performance.now() - started > timeoutMs)
      throw new Error(`${base} did not become healthy within ${timeoutMs / 1000} s`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/**
 * Fails when something already listens on `port` of 127.0.0.1: a benchmark that started its
 * server there would otherwise measure whatever answered (another engineer's bench server).
 */
export function assertPortFree(port: number): Promise<void> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once('error', (err: NodeJS.ErrnoException) =>
      reject(
        err.code === 'EADDRINUSE'
          ? new Error(`port ${port} is in use by another process: choose another with --port`)
          : err,
      ),
    );
    s.listen(port, '127.0.0.1', () => s.close(() => resolve()));
  });
}

/** A TCP port on 127.0.0.1 that nothing listens on now (the kernel picks it). */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}
