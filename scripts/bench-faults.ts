/**
 * Fault benchmark: fieldwork while things break. On a PostgreSQL cluster and a fake mail
 * server of its own (so nobody else's services go down), it seeds the demo study and a live
 * bench study, starts two API instances (EMBEDDED_WORKER=false) and one worker process, and
 * spreads simulated respondents across both instances (scripts/respondent-load.ts, its own
 * process: a respondent that gets no answer from its instance tries the other, as behind a
 * load balancer). During the load it:
 *   - stops the mail server, sends the invitations (they wait in the outbox), starts it again
 *     after 30 s;
 *   - kills the worker with SIGKILL while a panel mixed logit estimates (after its first
 *     iteration), and starts it again;
 *   - kills one API instance with SIGKILL and starts it again;
 *   - restarts PostgreSQL;
 *   - terminates every backend (pg_terminate_backend).
 * Then it reconciles every answer the server acknowledged against the database, counts the
 * mail each invitee received, and waits for the estimation to end: once silent for two minutes
 * the workers' sweep queues it again and the restarted worker resumes it from its last
 * checkpoint (or, past its last attempt, fails it with a reason) — never left running. It
 * prints how the estimation ended and from which iteration it resumed.
 *
 * Usage: npm run bench:faults [-- --respondents 300] [-- --invitees 40] [-- --json]
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createDb } from '../db/client';
import {
  assertPortFree,
  benchServerEnv,
  startProcess,
  waitForHealth,
  type ServerProcess,
} from './lib/server-process';
import { runLoadClient } from './lib/load-client-process';
import { sampleLoadAverage } from './lib/load-stats';
import { createBenchStudy, readStoredAnswers, reconcile } from './lib/bench-study';
import { seedScratchDemo, startDemoMixedRun, waitForRun } from './lib/bench-demo-run';
import { privateMail, startPrivateCluster } from './lib/fault-services';
import { inviteAll, mailOutcome, signInDemoEditor } from './lib/bench-invitees';
import { readBenchCli, runBench } from './lib/bench-cli';

const cli = readBenchCli(process.argv.slice(2), { timestamps: true });
const { asJson, log } = cli;
const arg = cli.number;
const RESPONDENTS = arg('respondents', 300);
const INVITEES = arg('invitees', 40);
const PG_PORT = arg('pg-port', 54349);
const API_PORT = arg('port', 5291);
const MAIL_OUTAGE_MS = 30_000;

const root = path.resolve(import.meta.dirname, '..');
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function main() {
  const work = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-faults-'));
  fs.chmodSync(work, 0o755);
  const logDir = path.join(root, '.data', 'bench');
  const cluster = startPrivateCluster(path.join(work, 'data'), PG_PORT, 'cw_faults');
  const mail = privateMail(path.join(work, 'data'), 1325, 1380);
  mail.start();
  const { db, pool } = createDb(cluster.url, { max: 2, statementTimeoutMs: 120_000 });
  pool.on('error', () => {});
  const bases = [API_PORT, API_PORT + 1].map((p) => `http://127.0.0.1:${p}`);
  const env = (port: number) => ({
    ...benchServerEnv({
      port,
      // Both instances serve one site: links and the same-origin check name the first.
      appUrl: bases[0],
      databaseUrl: cluster.url,
      dataDir: work,
      embeddedWorker: false,
    }),
    TRUSTED_ORIGINS: bases[1],
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(mail.smtpPort),
  });
  const shared = env(API_PORT);
  const startApi = (i: number) =>
    startProcess({
      entry: 'server/main.ts',
      logFile: path.join(logDir, `faults-api-${i}.log`),
      env: { ...shared, PORT: String(API_PORT + i) },
    });
  const startWorker = () =>
    startProcess({
      entry: 'server/worker.ts',
      logFile: path.join(logDir, 'faults-worker.log'),
      env: { ...shared, WORKER_THREADS: '1' },
    });
  const procs: ServerProcess[] = [];
  const faults: Array<{ at: number; what: string }> = [];
  try {
    log(`bench:faults — private PostgreSQL on ${PG_PORT}; seeding the demo study…`);
    const credentials = await seedScratchDemo(cluster.url, work);
    for (const i of [0, 1]) await assertPortFree(API_PORT + i);
    const api = [startApi(0), startApi(1)];
    let worker = startWorker();
    procs.push(...api, worker);
    await Promise.all(bases.map((b) => waitForHealth(b)));
    log('two API instances and one worker are up');
    // The bench study belongs to the demo team, whose editor sends its invitations.
    const editor = await signInDemoEditor(bases[1], credentials);
    const { publicId, studyId } = await createBenchStudy(db, { teamId: editor.teamId });

    const load = sampleLoadAverage(os.loadavg);
    const t0 = Date.now();
    const note = (what: string) => {
      faults.push({ at: Number(((Date.now() - t0) / 1000).toFixed(1)), what });
      log(what);
    };
    const answering = runLoadClient({
      bases,
      publicId,
      respondents: RESPONDENTS,
      firstRespondent: 0,
      rampMs: 20_000,
      thinkMs: 3_000,
      retryShare: 0.1,
      seed: 11,
      giveUpMs: 180_000,
    });

    // Mail: down before anything is sent, so that every message is counted after it is back.
    mail.stop();
    note('mail server stopped');
    const invited = await inviteAll(editor, studyId, INVITEES);
    note(`${invited.count} invitations sent while the mail server is down`);
    const mailBack = sleep(MAIL_OUTAGE_MS).then(() => {
      mail.start();
      note('mail server started again');
    });

    // Worker death during an estimation.
    const run = await startDemoMixedRun(bases[1], credentials);
    // After its first iteration: the job saves the checkpoint before the progress that shows
    // it, so the restarted worker has an iterate to resume from.
    await waitForRun(
      run,
      (r) => r.status === 'running' && (r.progress.iteration ?? 0) >= 1,
      120_000,
    );
    await worker.kill();
    note('worker killed (SIGKILL) while the mixed logit estimates');
    const killedAt = Date.now();
    worker = startWorker();
    procs.push(worker);

    await sleep(2_000);
    await api[0].kill();
    note('API instance 1 killed (SIGKILL)');
    await sleep(2_000);
    api[0] = startApi(0);
    procs.push(api[0]);
    await waitForHealth(bases[0]);
    note('API instance 1 started again');

    await sleep(3_000);
    cluster.restart();
    note('PostgreSQL restarted');
    await sleep(5_000);
    note(`pg_terminate_backend ended ${await cluster.terminateBackends()} sessions`);

    const r = await answering;
    note('load finished');
    await mailBack;
    const loadAverage1m = load.stop();

    const stored = await readStoredAnswers(db, studyId);
    const counts = reconcile(r.acknowledged, stored);
    const mails = await mailOutcome(mail, invited.addresses, 240_000);
    note('mail settled');
    const final = await waitForRun(
      run,
      (x) => x.status !== 'running' && x.status !== 'queued',
      300_000,
    ).catch((err: Error) => ({
      status: 'still running',
      error: err.message,
      attempts: null,
      progress: null,
    }));
    const result = {
      respondents: RESPONDENTS,
      instances: 2,
      sent: counts.sent,
      stored: counts.stored,
      lost: counts.lost,
      duplicated: counts.duplicated,
      errors5xx: r.errors5xx,
      networkErrors: r.networkErrors,
      unsent: r.unsent,
      unexpected: r.errorsOther.length,
      longestOutageSeconds: Number((r.longestOutageMs / 1000).toFixed(1)),
      invitations: invited.count,
      mailsLost: mails.lost,
      mailsDoubled: mails.doubled,
      estimation: {
        status: final.status,
        error: final.error ?? null,
        // Claims by a worker: 2 after one resume.
        attempts: final.attempts,
        resumedFromIteration: final.progress?.resumed?.fromIteration ?? null,
        secondsFromKillToEnd: Number(((Date.now() - killedAt) / 1000).toFixed(0)),
      },
      faults,
      node: process.version,
      cpus: os.cpus().length,
      loadAverage1m,
    };
    if (asJson) console.log(JSON.stringify(result));
    else console.log(JSON.stringify(result, null, 2));
    if (counts.lost > 0 || counts.duplicated > 0 || mails.lost > 0 || mails.doubled > 0)
      process.exitCode = 1;
  } finally {
    for (const p of procs) await p.stop(5_000);
    await pool.end();
    mail.stop();
    cluster.stop();
    fs.rmSync(work, { recursive: true, force: true });
  }
}

runBench(main);
