/**
 * Fieldwork load benchmark, measured from outside as deployed. In a scratch database (never
 * the demo database) it seeds the demo study, puts a bench study live, and starts the
 * server as its own process (`node --import tsx server/main.ts`, production settings, embedded
 * worker on). The simulated respondents run in another process (scripts/respondent-load.ts):
 * they arrive over a ramp, answer with a short think time, and re-send one answer in ten.
 * The bench study has 24 choice tasks per respondent by default (`--tasks`), so that with a
 * 5 s ramp and a 400 ms think time all 500 respondents are answering at once for several
 * seconds: the headline figures (answers per second, answer latency) are those of that
 * window of full load, the "500 concurrent respondents"; the whole-run figures, ramp
 * and tail included, are printed beside them.
 *
 * Two loads in one run, side by side: first with the machine otherwise idle, then while a
 * panel mixed logit of the demo study estimates in the same server process. Every answer the
 * server acknowledged is looked up in the database afterwards (lost, duplicated).
 *
 * With `--compare-with <another checkout>` (e.g. a worktree of main) the other checkout's server
 * takes the same idle load first, against the same database and the same machine, so that two
 * implementations are compared side by side in one run (the `baseline` figures).
 *
 * Usage: npm run bench:fieldwork [-- --respondents 500] [-- --ramp 5] [-- --think 400] [-- --tasks 24]
 *        [-- --port 5281] [-- --pool <connections>] [-- --compare-with <dir>] [-- --socket]
 *        [-- --client-processes 2] [-- --instances 2] [-- --json]
 * `--instances N`: the server runs N web processes on its port (WEB_INSTANCES).
 * `--socket`: the servers reach PostgreSQL through its Unix socket, as README advises when the
 * database runs on the same host (TCP on loopback costs more CPU per query).
 */
import os from 'node:os';
import path from 'node:path';
import { adminUrl } from './lib/scratch-db';
import {
  assertPortFree,
  benchServerEnv,
  startProcess,
  waitForHealth,
  type ServerProcess,
} from './lib/server-process';
import { runLoadClient } from './lib/load-client-process';
import type { LoadResult } from './lib/respondent-load';
import { fullLoadWindow, latencySummary, sampleLoadAverage } from './lib/load-stats';
import { createBenchStudy, readStoredAnswers, reconcile } from './lib/bench-study';
import { seedScratchDemo, startDemoMixedRun, waitForRun } from './lib/bench-demo-run';
import { measureCpu } from './lib/process-cpu';
import { measureTcp } from './lib/tcp-counters';
import { askEventLoopDelay } from '../server/lib/event-loop-delay';
import type pg from 'pg';
import { readBenchCli, runBench } from './lib/bench-cli';
import { openBenchWorkspace } from './lib/bench-workspace';

const cli = readBenchCli();
const { asJson, log } = cli;
const arg = cli.number;
const RESPONDENTS = arg('respondents', 500);
const RAMP_S = arg('ramp', 5);
const THINK_MS = arg('think', 400);
/** Choice tasks per respondent; with fewer, the 500 never all answer at the same time. */
const TASKS = arg('tasks', 24);
const PORT = arg('port', 5281);
/** Database connections of the server process; by default the server's own (DB_POOL_SIZE). */
const POOL = arg('pool', 0);
/** Load processes the simulated respondents are spread over (each outside the server). */
const CLIENT_PROCESSES = arg('client-processes', 1);
/** Web processes of the benchmarked server (WEB_INSTANCES); the baseline checkout gets the same setting. */
const INSTANCES = arg('instances', 1);
/** Servers reach PostgreSQL through its Unix socket instead of TCP (same host only). */
const SOCKET = cli.has('socket');
const RETRY_SHARE = 0.1;
const BASELINE_DIR = cli.path('compare-with');

const root = path.resolve(import.meta.dirname, '..');

type Phase = Awaited<ReturnType<typeof measure>>;

async function measure(
  base: string,
  publicId: string,
  first: number,
  cpu: { server: ServerProcess; pool: pg.Pool; database: string },
) {
  const load = sampleLoadAverage(os.loadavg);
  const cpuTime = await measureCpu(cpu.server.pid, cpu.pool, cpu.database);
  // Asking resets the server's histogram, so the answer after the load covers this phase.
  await askEventLoopDelay(cpu.server.child);
  const tcp = measureTcp(PORT);
  const r: LoadResult = await runLoadClient(
    {
      bases: [base],
      publicId,
      respondents: RESPONDENTS,
      firstRespondent: first,
      rampMs: RAMP_S * 1000,
      thinkMs: THINK_MS,
      retryShare: RETRY_SHARE,
      seed: 7,
      giveUpMs: 60_000,
    },
    CLIENT_PROCESSES,
  );
  const seconds = (r.endedAt - r.startedAt) / 1000;
  const eventLoopDelay = (await askEventLoopDelay(cpu.server.child)) ?? {
    unavailable: 'this checkout does not report its event-loop delay',
  };
  return {
    r,
    seconds,
    loadAverage1m: load.stop(),
    cpuMs: await cpuTime.stop(),
    tcp: tcp.stop(),
    eventLoopDelay,
  };
}

/** CPU milliseconds per request (session starts and answers, re-sent ones included). */
function cpuPerRequest(p: Phase) {
  const requests = p.r.answerMs.length + p.r.sessionMs.length;
  const per = (ms: number | null) => (ms === null ? null : Number((ms / requests).toFixed(2)));
  return {
    requests,
    serverMs: p.cpuMs.serverMs,
    databaseMs: p.cpuMs.databaseMs,
    serverMsPerRequest: per(p.cpuMs.serverMs),
    databaseMsPerRequest: per(p.cpuMs.databaseMs),
    // The simulated phones: when their process is near a whole core, they are the limit.
    loadClientMs: p.r.cpuMs,
    loadClientMsPerRequest: per(p.r.cpuMs),
    loadClientProcesses: p.r.processes,
    loadClientCoreShare: Number((p.r.cpuMs / (p.seconds * 1000)).toFixed(2)),
  };
}

function phaseFigures(p: Phase) {
  return {
    respondents: RESPONDENTS,
    seconds: Number(p.seconds.toFixed(2)),
    answersAcknowledged: p.r.acknowledged.length,
    // A respondent whose start was given up (giveUpMs of timeouts) never answers at all.
    respondentsStarted: p.r.respondentsStarted,
    respondentsFinished: p.r.respondentsFinished,
    // Over the whole load, ramp and tail included.
    answersPerSecond: Math.round(p.r.acknowledged.length / p.seconds),
    // While all of them answer at once (see fullLoadWindow).
    fullLoad: fullLoadWindow(p.r.spans, p.r.ackAt, { ms: p.r.answerMs, doneAt: p.r.answerDoneAt }),
    answerLatencyMs: latencySummary(p.r.answerMs),
    sessionStartLatencyMs: latencySummary(p.r.sessionMs),
    replaysAsked: p.r.replaysAsked,
    replaysConfirmed: p.r.replaysConfirmed,
    errors5xx: p.r.errors5xx,
    errors429: p.r.errors429,
    networkErrors: p.r.networkErrors,
    unexpected: p.r.errorsOther.length,
    unsent: p.r.unsent,
    // Node accepts one connection per turn of its event loop: a long turn queues new phones.
    serverEventLoopDelayMs: p.eventLoopDelay,
    tcp: p.tcp,
    cpu: cpuPerRequest(p),
    loadAverage1m: p.loadAverage1m,
  };
}

/** The scratch database through the cluster's (first) Unix socket directory. */
async function socketUrl(pool: pg.Pool, database: string): Promise<string> {
  const r = await pool.query<{ dirs: string }>(
    "select current_setting('unix_socket_directories') as dirs",
  );
  const dir = r.rows[0]?.dirs.split(',')[0]?.trim();
  if (!dir) throw new Error('--socket: this PostgreSQL listens on no Unix socket');
  const admin = new URL(adminUrl());
  // The socket file is named after the port; the host parameter replaces the host name.
  const user = admin.username || 'postgres';
  return `postgres://${user}@localhost:${admin.port || 5432}/${database}?host=${encodeURIComponent(dir)}`;
}

async function main() {
  const workspace = await openBenchWorkspace('cw-bench', { max: 4, statementTimeoutMs: 120_000 });
  const { scratch, work, db, pool } = workspace;
  const base = `http://127.0.0.1:${PORT}`;
  let server: ReturnType<typeof startProcess> | null = null;
  try {
    log(`bench:fieldwork — scratch database ${scratch.name}; seeding the demo study…`);
    const credentials = await seedScratchDemo(scratch.url, work);
    const { publicId, studyId } = await createBenchStudy(db, { tasksPerRespondent: TASKS });
    const serverEnv = {
      ...benchServerEnv({
        port: PORT,
        appUrl: base,
        databaseUrl: SOCKET ? await socketUrl(pool, scratch.name) : scratch.url,
        dataDir: work,
        embeddedWorker: true,
      }),
      WEB_INSTANCES: String(INSTANCES),
      ...(POOL > 0 ? { DB_POOL_SIZE: String(POOL) } : {}),
      // No mail in this benchmark: nothing listens there.
      SMTP_PORT: '9',
    };
    const cpuOf = { pool, database: scratch.name };
    let baseline: Phase | null = null;
    if (BASELINE_DIR) {
      log(`  baseline: ${BASELINE_DIR}, ${RESPONDENTS} respondents…`);
      await assertPortFree(PORT);
      const other = startProcess({
        entry: 'server/main.ts',
        cwd: BASELINE_DIR,
        logFile: path.join(root, '.data', 'bench', 'fieldwork-baseline-server.log'),
        env: serverEnv,
      });
      try {
        await waitForHealth(base);
        baseline = await measure(base, publicId, 2 * RESPONDENTS, { ...cpuOf, server: other });
      } finally {
        await other.stop();
      }
    }
    await assertPortFree(PORT);
    server = startProcess({
      entry: 'server/main.ts',
      logFile: path.join(root, '.data', 'bench', 'fieldwork-server.log'),
      env: serverEnv,
    });
    const startupSeconds = await waitForHealth(base);
    log(`  server pid ${server.pid} healthy after ${startupSeconds.toFixed(1)} s`);

    log(`  load 1: ${RESPONDENTS} respondents, machine otherwise idle…`);
    const cpu = { ...cpuOf, server };
    const idle = await measure(base, publicId, 0, cpu);

    // On a machine so loaded that the server is still answering abandoned starts, signing in
    // to start the run can time out: the idle figures are then printed without this phase.
    const estimating = await (async () => {
      log('  starting a panel mixed logit on the demo study…');
      const run = await startDemoMixedRun(base, credentials);
      const before = await waitForRun(run, (r) => r.progress?.stage === 'estimating');
      log(`  load 2: ${RESPONDENTS} respondents while it estimates…`);
      const busy = await measure(base, publicId, RESPONDENTS, cpu);
      const after = await run.get();
      await run.cancel().catch(() => {});
      return { busy, before, after };
    })().catch((err: Error) => ({ unavailable: `estimating phase failed: ${err.message}` }));
    const busy = 'busy' in estimating ? estimating.busy : null;

    const stored = await readStoredAnswers(db, studyId);
    const counts = reconcile(
      [
        ...idle.r.acknowledged,
        ...(busy?.r.acknowledged ?? []),
        ...(baseline?.r.acknowledged ?? []),
      ],
      stored,
    );
    const idleP99 = latencySummary(idle.r.answerMs).p99;
    const busyP99 = busy ? latencySummary(busy.r.answerMs).p99 : null;
    const idleFull = phaseFigures(idle).fullLoad;
    const result = {
      respondents: RESPONDENTS,
      screensPerRespondent: TASKS + 1,
      rampSeconds: RAMP_S,
      dbPoolSize: POOL > 0 ? POOL : 'server default',
      databaseConnection: SOCKET ? 'unix socket' : 'tcp',
      thinkMs: THINK_MS,
      webInstances: INSTANCES,
      // While all of them answer at once (null when they never do; see fullLoadWindow).
      answersPerSecondAtFullLoad: idleFull.answersPerSecond,
      answerP99AtFullLoadMs: idleFull.answerLatencyMs?.p99 ?? null,
      fullLoadSeconds: idleFull.seconds,
      // Over the whole load, the ramp's session starts and the tail included.
      answersPerSecond: phaseFigures(idle).answersPerSecond,
      answerP99Ms: idleP99,
      sessionStartP99Ms: latencySummary(idle.r.sessionMs).p99,
      answersLost: counts.lost,
      answersDuplicated: counts.duplicated,
      answerP99WhileEstimatingMs: busyP99,
      estimatingOverIdleP99: busyP99 === null ? null : Number((busyP99 / idleP99).toFixed(2)),
      serverEventLoopDelayMs: idle.eventLoopDelay,
      listenOverflows: 'unavailable' in idle.tcp ? null : idle.tcp.listenOverflows,
      synRetransmits: 'unavailable' in idle.tcp ? null : idle.tcp.synRetransmits,
      idle: phaseFigures(idle),
      whileEstimating:
        'busy' in estimating
          ? {
              ...phaseFigures(estimating.busy),
              run: {
                model: 'mixed',
                statusAtStart: estimating.before.status,
                iterationAtStart: estimating.before.progress?.iteration ?? 0,
                statusAtEnd: estimating.after.status,
                iterationAtEnd: estimating.after.progress?.iteration ?? null,
              },
            }
          : estimating,
      baseline: baseline ? { checkout: BASELINE_DIR, ...phaseFigures(baseline) } : null,
      reconciliation: counts,
      serverStartupSeconds: Number(startupSeconds.toFixed(1)),
      node: process.version,
      cpus: os.cpus().length,
      /** Other processes share the machine; the 1-minute load average says how busy it was. */
      loadAverage1m: Number(os.loadavg()[0].toFixed(2)),
    };
    if (asJson) console.log(JSON.stringify(result));
    else {
      for (const [name, p] of [
        ...(result.baseline ? ([['baseline (idle)', result.baseline]] as const) : []),
        ['idle', result.idle],
        ...('unavailable' in result.whileEstimating
          ? []
          : ([['while estimating', result.whileEstimating]] as const)),
      ] as const)
        log(
          `  ${name.padEnd(17)} ${p.answersPerSecond} answers/s (all answering: ${p.fullLoad.answersPerSecond ?? '–'} answers/s for ${p.fullLoad.seconds} s, answer p99 ${p.fullLoad.answerLatencyMs?.p99 ?? '–'} ms; peak ${p.fullLoad.peakRespondentsAnswering} at once) · answer p50 ${p.answerLatencyMs.p50} p99 ${p.answerLatencyMs.p99} ms · session start p99 ${p.sessionStartLatencyMs.p99} ms · CPU per request: server ${p.cpu.serverMsPerRequest} ms, PostgreSQL ${p.cpu.databaseMsPerRequest} ms, load client ${p.cpu.loadClientMsPerRequest} ms · event-loop delay p99 ${'p99Ms' in p.serverEventLoopDelayMs ? p.serverEventLoopDelayMs.p99Ms : '–'} ms · listen overflows ${'listenOverflows' in p.tcp ? p.tcp.listenOverflows : '–'} · load ${p.loadAverage1m.mean}`,
        );
      log(
        `  reconciliation   sent ${counts.sent}, stored ${counts.stored}, lost ${counts.lost}, duplicated ${counts.duplicated}`,
      );
      log(`  p99 while estimating / idle = ${result.estimatingOverIdleP99}`);
    }
    if (counts.lost > 0 || counts.duplicated > 0) process.exitCode = 1;
  } finally {
    await workspace.close(server);
  }
}

runBench(main);
