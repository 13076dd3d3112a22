/**
 * The supervisor of several web processes (server/web-cluster.ts): first with stand-in
 * processes, to check who gets the job worker and that a dead process is replaced with its
 * role; then with real node:cluster processes killed with SIGKILL. No timing is asserted.
 */
import { afterEach, describe, expect, it, vi } from 'vitest';
import cluster, { type Worker } from 'node:cluster';
import { EventEmitter } from 'node:events';
import path from 'node:path';
import { instanceEnv, RESTART_DELAY_MS, startWebCluster } from '../../server/web-cluster';

type FakeWorker = EventEmitter & {
  env: Record<string, string>;
  dead: boolean;
  process: { pid: number; kill: (signal: string) => void };
  isDead: () => boolean;
};

function fakeFork() {
  const forked: FakeWorker[] = [];
  const fork = (env: Record<string, string>) => {
    const w = new EventEmitter() as FakeWorker;
    w.env = env;
    w.dead = false;
    w.isDead = () => w.dead;
    w.process = {
      pid: 1000 + forked.length,
      kill: () => {
        w.dead = true;
        w.emit('exit', 0, 'SIGTERM');
      },
    };
    forked.push(w);
    return w as unknown as Worker;
  };
  return { forked, fork };
}

const quietLogger = () => ({ info: vi.fn(), error: vi.fn() });

afterEach(() => {
  vi.useRealTimers();
});

describe('instanceEnv', () => {
  it('when the embedded worker is on, gives it to the first web process only', () => {
    expect(instanceEnv(0, true)).toEqual({ EMBEDDED_WORKER: 'true' });
    expect(instanceEnv(1, true)).toEqual({ EMBEDDED_WORKER: 'false' });
    expect(instanceEnv(2, true)).toEqual({ EMBEDDED_WORKER: 'false' });
  });

  it('when the embedded worker is off, gives it to none', () => {
    expect(instanceEnv(0, false)).toEqual({ EMBEDDED_WORKER: 'false' });
  });
});

describe('startWebCluster', () => {
  it('starts one web process per instance, only the first with the job worker', async () => {
    const { forked, fork } = fakeFork();
    const c = startWebCluster({ instances: 3, embeddedWorker: true, logger: quietLogger(), fork });
    expect(forked.map((w) => w.env.EMBEDDED_WORKER)).toEqual(['true', 'false', 'false']);
    expect(c.workers()).toHaveLength(3);
    await c.stop();
  });

  it('when the process with the job worker dies, starts a new one with that role and logs it', async () => {
    vi.useFakeTimers();
    const { forked, fork } = fakeFork();
    const logger = quietLogger();
    const c = startWebCluster({ instances: 2, embeddedWorker: true, logger, fork });
    forked[0].dead = true;
    forked[0].emit('exit', null, 'SIGKILL');
    expect(c.workers()).toHaveLength(1);
    expect(logger.error).toHaveBeenCalledWith(
      expect.objectContaining({ instance: 0, signal: 'SIGKILL' }),
      expect.stringContaining('exited'),
    );
    expect(forked).toHaveLength(2);
    await vi.advanceTimersByTimeAsync(RESTART_DELAY_MS);
    expect(forked).toHaveLength(3);
    expect(forked[2].env.EMBEDDED_WORKER).toBe('true');
    expect(c.workers()).toHaveLength(2);
    expect(logger.info).toHaveBeenCalledWith(
      expect.objectContaining({ instance: 0 }),
      'web process 0 restarted',
    );
    await c.stop();
  });

  it('when stopped, ends every web process and starts none again', async () => {
    vi.useFakeTimers();
    const { forked, fork } = fakeFork();
    const c = startWebCluster({ instances: 2, embeddedWorker: false, logger: quietLogger(), fork });
    await c.stop();
    expect(forked.every((w) => w.dead)).toBe(true);
    await vi.advanceTimersByTimeAsync(RESTART_DELAY_MS * 2);
    expect(forked).toHaveLength(2);
    expect(c.workers()).toHaveLength(0);
  });

  it('with real processes, replaces one killed with SIGKILL', async () => {
    cluster.setupPrimary({
      exec: path.resolve(import.meta.dirname, '../fixtures/cluster-web-process.mjs'),
      silent: true,
    });
    const logger = quietLogger();
    const c = startWebCluster({ instances: 2, embeddedWorker: true, logger });
    const ready = (w: Worker) =>
      new Promise<string>((resolve) =>
        w.on('message', (m: { type?: string; embeddedWorker?: string }) => {
          if (m.type === 'fixture-ready') resolve(m.embeddedWorker ?? '');
        }),
      );
    try {
      const [first, second] = c.workers();
      expect(await Promise.all([ready(first), ready(second)])).toEqual(['true', 'false']);
      const replaced = new Promise<Worker>((resolve) => cluster.once('fork', resolve));
      first.process.kill('SIGKILL');
      const replacement = await replaced;
      expect(replacement.process.pid).not.toBe(first.process.pid);
      expect(await ready(replacement)).toBe('true');
      expect(c.workers()).toHaveLength(2);
      expect(logger.error).toHaveBeenCalledTimes(1);
    } finally {
      await c.stop();
    }
    expect(c.workers()).toHaveLength(0);
  }, 30_000);
});
