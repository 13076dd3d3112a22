/**
 * WEB_INSTANCES with real processes: `server/main.ts` as deployed, with two web processes on
 * one port. Both answer, the primary reports both event loops, and a web process killed with
 * SIGKILL (as an out-of-memory kill would) is replaced while the other keeps answering.
 */
import { afterAll, describe, expect, it } from 'vitest';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { useTestApp } from '../../support/test-app';
import { sleep, waitFor } from '../../support/wait-for';
import {
  freePort,
  startProcess,
  waitForHealth,
  type ServerProcess,
} from '../../../scripts/lib/server-process';
import { askEventLoopDelay } from '../../../server/lib/event-loop-delay';

const t = useTestApp();
let server: ServerProcess | null = null;
const logDir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-web-instances-'));
const logFile = path.join(logDir, 'server.log');

afterAll(async () => {
  await server?.stop(5_000);
  fs.rmSync(logDir, { recursive: true, force: true });
});

/** Web processes whose parent is `pid` (from /proc; tsx's esbuild service is a child too). */
function childrenOf(pid: number): number[] {
  return fs
    .readdirSync('/proc')
    .filter((d) => /^\d+$/.test(d))
    .filter((d) => {
      try {
        const stat = fs.readFileSync(`/proc/${d}/stat`, 'utf8');
        if (Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]) !== pid) return false;
        return fs.readFileSync(`/proc/${d}/cmdline`, 'utf8').includes('server/main.ts');
      } catch {
        return false;
      }
    })
    .map(Number);
}

describe('WEB_INSTANCES=2', () => {
  it('runs two web processes on one port and replaces one killed with SIGKILL', async () => {
    const port = await freePort();
    const base = `http://127.0.0.1:${port}`;
    server = startProcess({
      entry: 'server/main.ts',
      logFile,
      env: {
        NODE_ENV: 'test',
        HOST: '127.0.0.1',
        PORT: String(port),
        DATABASE_URL: t.deps.env.DATABASE_URL,
        JWT_SECRET: t.deps.env.JWT_SECRET,
        DATA_DIR: logDir,
        SMTP_PORT: String(t.deps.env.SMTP_PORT),
        WEB_INSTANCES: '2',
        EMBEDDED_WORKER: 'false',
      },
    });
    await waitForHealth(base, 120_000);
    const first = await waitFor(() => {
      const c = childrenOf(server!.pid);
      return c.length === 2 ? c : null;
    }, 60_000);
    // Both answer the primary's question once both have started.
    let delay = await askEventLoopDelay(server.child, 10_000);
    for (let i = 0; i < 60 && delay?.processes !== 2; i++) {
      await sleep(1_000);
      delay = await askEventLoopDelay(server.child, 10_000);
    }
    expect(delay?.processes).toBe(2);

    process.kill(first[0], 'SIGKILL');
    const replaced = await waitFor(() => {
      const c = childrenOf(server!.pid);
      return c.length === 2 && !c.includes(first[0]) ? c : null;
    }, 60_000);
    expect(replaced).toContain(first[1]);
    await waitForHealth(base, 120_000);
    await waitFor(
      () => (fs.readFileSync(logFile, 'utf8').includes('restarted') ? true : null),
      10_000,
    );
    const log = fs.readFileSync(logFile, 'utf8');
    expect(log).toMatch(/web process \d exited; starting it again/);
  }, 300_000);
});
