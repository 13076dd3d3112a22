/**
 * Several web processes on one machine (WEB_INSTANCES > 1), sharing one port through
 * node:cluster: the primary process holds the listening socket and hands each new connection
 * to a web process in turn (the cluster module's round robin), so every process accepts
 * connections and answers requests on a core of its own. The primary answers no requests and
 * opens no database connections after the migration; it only supervises:
 * - a web process that dies is replaced after RESTART_DELAY_MS (logged), with the same role;
 * - only the first web process runs the embedded job worker (EMBEDDED_WORKER), so the pool of
 *   design and estimation threads never multiplies with the web processes; its replacement
 *   takes the role over.
 * Everything else per process stays correct as it is: frozen versions are cached per process
 * (they never change), and the respondent rate limits count in each process up to a quarter of
 * the limit before PostgreSQL counts them, as with separate instances (README, "Past one
 * machine").
 */
import cluster, { type Worker } from 'node:cluster';
import type { Logger } from './lib/logger';

/** A dead web process is started again after this long (the supervisor's promise is 2 s). */
export const RESTART_DELAY_MS = 1_000;

export type WebClusterOptions = {
  instances: number;
  /** Whether the first web process runs the embedded job worker (EMBEDDED_WORKER). */
  embeddedWorker: boolean;
  logger: Pick<Logger, 'info' | 'error'>;
  /** Starts one web process with these settings added (cluster.fork; tests give another script). */
  fork?: (env: Record<string, string>) => Worker;
  restartDelayMs?: number;
};

export type WebCluster = {
  /** The web processes running now. */
  workers(): Worker[];
  /** Ends every web process (SIGTERM, so each finishes its requests) and stops restarting them. */
  stop(): Promise<void>;
};

/** The settings a web process starts with: only instance 0 may run jobs. */
export function instanceEnv(index: number, embeddedWorker: boolean): Record<string, string> {
  return { EMBEDDED_WORKER: String(embeddedWorker && index === 0) };
}

export function startWebCluster(opts: WebClusterOptions): WebCluster {
  const fork = opts.fork ?? ((env) => cluster.fork(env));
  const delay = opts.restartDelayMs ?? RESTART_DELAY_MS;
  const running = new Map<number, Worker>();
  let stopping = false;

  const start = (index: number) => {
    const worker = fork(instanceEnv(index, opts.embeddedWorker));
    running.set(index, worker);
    worker.once('exit', (code, signal) => {
      if (running.get(index) === worker) running.delete(index);
      if (stopping) return;
      opts.logger.error(
        { pid: worker.process.pid, code, signal, instance: index },
        `web process ${index} exited; starting it again in ${delay} ms`,
      );
      setTimeout(() => {
        if (stopping) return;
        const again = start(index);
        opts.logger.info(
          { pid: again.process.pid, instance: index },
          `web process ${index} restarted`,
        );
      }, delay);
    });
    return worker;
  };
  for (let i = 0; i < opts.instances; i++) start(i);

  return {
    workers: () => [...running.values()],
    async stop() {
      stopping = true;
      await Promise.all(
        [...running.values()].map(
          (w) =>
            new Promise<void>((resolve) => {
              if (w.isDead()) return resolve();
              w.once('exit', () => resolve());
              w.process.kill('SIGTERM');
            }),
        ),
      );
    },
  };
}
