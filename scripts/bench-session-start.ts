/**
 * Session-start benchmark: the server's and PostgreSQL's CPU time per session start, measured
 * from outside as deployed. bench:fieldwork mixes starts with ten times as many answers, so
 * its CPU per request hides what one start costs; here every request is a start. In a scratch
 * database it puts the 10-task bench study live (scripts/lib/bench-study.ts), starts the server
 * as its own process (production settings) and sends `--starts` session starts, each from a
 * new phone (its own connection and address), `--concurrency` at a time, after a warm-up.
 * With `--panel` every start carries a new panel id (the de-duplication lookup runs).
 *
 * With `--compare-with <another checkout>` that checkout's server takes the same starts first,
 * against the same database, so that two implementations are compared in one run.
 *
 * Usage: npm run bench:session-start [-- --starts 2000] [-- --concurrency 8] [-- --panel]
 *        [-- --port 5283] [-- --compare-with <dir>] [-- --json]
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createDb, migrateDb } from '../db/client';
import { adminUrl, createScratchDatabase } from './lib/scratch-db';
import { benchServerEnv, startProcess, waitForHealth } from './lib/server-process';
import { PhoneConnection } from './lib/phone-connection';
import { createBenchStudy } from './lib/bench-study';
import { latencySummary, sampleLoadAverage } from './lib/load-stats';
import { measureCpu } from './lib/process-cpu';
import { readBenchCli, runBench } from './lib/bench-cli';

const cli = readBenchCli();
const { asJson, log } = cli;
const STARTS = cli.number('starts', 2000);
const CONCURRENCY = cli.number('concurrency', 8);
const WARM_UP = 100;
const PORT = cli.number('port', 5283);
const PANEL = cli.has('panel');
const BASELINE_DIR = cli.path('compare-with');
const root = path.resolve(import.meta.dirname, '..');

/** `count` starts, `CONCURRENCY` at a time, phones numbered from `first`; their latencies. */
async function sendStarts(base: string, publicId: string, first: number, count: number) {
  const ms: number[] = [];
  const failures: Record<string, number> = {};
  let next = 0;
  const one = async (n: number) => {
    const phone = new PhoneConnection(base, 15_000);
    const headers =
      'Content-Type: application/json\r\nAccept-Encoding: gzip, deflate, br\r\n' +
      `X-Forwarded-For: 10.${(n >> 16) & 255}.${(n >> 8) & 255}.${n & 255}\r\n`;
    const body = JSON.stringify({ params: PANEL ? { pid: `p${n}` } : {}, device: 'bench' });
    const t0 = performance.now();
    try {
      const reply = await phone.post(`/api/r/${publicId}/sessions`, headers, body);
      ms.push(performance.now() - t0);
      if (reply.status !== 201) failures[reply.status] = (failures[reply.status] ?? 0) + 1;
    } finally {
      phone.close();
    }
  };
  await Promise.all(
    Array.from({ length: CONCURRENCY }, async () => {
      while (next < count) await one(first + next++);
    }),
  );
  return { ms, failures };
}

async function measureServer(opts: {
  cwd?: string;
  env: Record<string, string>;
  publicId: string;
  first: number;
  cpuOf: { pool: Parameters<typeof measureCpu>[1]; database: string };
  logName: string;
}) {
  const base = `http://127.0.0.1:${PORT}`;
  const server = startProcess({
    entry: 'server/main.ts',
    cwd: opts.cwd,
    logFile: path.join(root, '.data', 'bench', opts.logName),
    env: opts.env,
  });
  try {
    await waitForHealth(base);
    await sendStarts(base, opts.publicId, opts.first, WARM_UP);
    const load = sampleLoadAverage(os.loadavg);
    const cpu = await measureCpu(server.pid, opts.cpuOf.pool, opts.cpuOf.database);
    const started = performance.now();
    const { ms, failures } = await sendStarts(base, opts.publicId, opts.first + WARM_UP, STARTS);
    const seconds = (performance.now() - started) / 1000;
    const used = await cpu.stop();
    const per = (x: number | null) => (x === null ? null : Number((x / STARTS).toFixed(2)));
    return {
      starts: STARTS,
      seconds: Number(seconds.toFixed(2)),
      startsPerSecond: Math.round(STARTS / seconds),
      latencyMs: latencySummary(ms),
      failures,
      cpu: {
        serverMs: used.serverMs,
        databaseMs: used.databaseMs,
        serverMsPerStart: per(used.serverMs),
        databaseMsPerStart: per(used.databaseMs),
      },
      loadAverage1m: load.stop(),
    };
  } finally {
    await server.stop();
  }
}

async function main() {
  const scratch = await createScratchDatabase(adminUrl(), 'cw_bench_start');
  const work = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-bench-start-'));
  const { db, pool } = createDb(scratch.url, { max: 4, statementTimeoutMs: 120_000 });
  pool.on('error', () => {});
  try {
    await migrateDb(db);
    const { publicId } = await createBenchStudy(db);
    const env = {
      ...benchServerEnv({
        port: PORT,
        databaseUrl: scratch.url,
        dataDir: work,
        embeddedWorker: true,
      }),
      SMTP_PORT: '9',
    };
    const cpuOf = { pool, database: scratch.name };
    const phones = WARM_UP + STARTS;
    let baseline = null;
    if (BASELINE_DIR) {
      log(`bench:session-start — baseline ${BASELINE_DIR}: ${STARTS} starts…`);
      baseline = {
        checkout: BASELINE_DIR,
        ...(await measureServer({
          cwd: BASELINE_DIR,
          env,
          publicId,
          first: phones,
          cpuOf,
          logName: 'session-start-baseline-server.log',
        })),
      };
    }
    log(`bench:session-start — this checkout: ${STARTS} starts…`);
    const current = await measureServer({
      env,
      publicId,
      first: 0,
      cpuOf,
      logName: 'session-start-server.log',
    });
    const result = {
      concurrency: CONCURRENCY,
      panelIds: PANEL,
      ...current,
      baseline,
      node: process.version,
      cpus: os.cpus().length,
      loadAverage1mAtEnd: Number(os.loadavg()[0].toFixed(2)),
    };
    if (asJson) console.log(JSON.stringify(result));
    else
      for (const [name, p] of [
        ...(baseline ? ([['baseline', baseline]] as const) : []),
        ['this checkout', current] as const,
      ])
        log(
          `  ${name.padEnd(14)} ${p.startsPerSecond} starts/s · p50 ${p.latencyMs.p50} p99 ${p.latencyMs.p99} ms · CPU per start: server ${p.cpu.serverMsPerStart} ms, PostgreSQL ${p.cpu.databaseMsPerStart} ms · failures ${JSON.stringify(p.failures)} · load ${p.loadAverage1m.mean}`,
        );
  } finally {
    await pool.end();
    await scratch.drop();
    fs.rmSync(work, { recursive: true, force: true });
  }
}

runBench(main);
