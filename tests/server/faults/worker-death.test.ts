/**
 * Worker death, with real processes: a separate worker (`npm run worker`, server/worker.ts)
 * takes an estimation from the real queue and is killed with SIGKILL in the middle of it, as
 * an out-of-memory kill would. The run stops beating; once it has been silent for
 * STALE_RUN_MS the sweep fails it with a reason a researcher can act on, so it is never left
 * "running" for ever; and a worker started afterwards takes the next run to done.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { createTestApp, type TestApp } from '../../support/test-app';
import { createTeamWithAllRoles } from '../../support/factories';
import { getRunForJob } from '../../../db/queries/runs';
import { startJobQueue, type JobQueue } from '../../../server/jobs/queue';
import { createJobKinds } from '../../../server/jobs/background';
import {
  STALE_RUN_MS,
  sweepStaleRuns,
  WORKER_LOST_ERROR,
} from '../../../server/jobs/estimation-job';
import { startProcess, type ServerProcess } from '../../../scripts/lib/server-process';
import { ignoreTeardownErrors, mixedLogitSpec, seedRunStudy, TRUE_MNL } from '../jobs/run-fixtures';

let t: TestApp;
let sender: JobQueue;
let team: Awaited<ReturnType<typeof createTeamWithAllRoles>>;
let base: string;
const workers: ServerProcess[] = [];
const logDir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-worker-death-'));

beforeAll(async () => {
  t = await createTestApp();
  ignoreTeardownErrors(t.deps.db);
  team = await createTeamWithAllRoles(t);
  const study = await seedRunStudy(t.deps.db, { teamId: team.teamId, respondents: 120 });
  base = `/api/teams/${team.teamId}/studies/${study.studyId}/runs`;
  // The API enqueues on the real queue; only the worker processes take jobs from it.
  sender = await startJobQueue(t.deps, { kinds: createJobKinds(), work: false });
  t.deps.jobs = sender;
}, 60_000);

afterAll(async () => {
  for (const w of workers) await w.stop(5_000);
  await sender?.stop();
  await t.close();
  fs.rmSync(logDir, { recursive: true, force: true });
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

function startWorker(): ServerProcess {
  const worker = startProcess({
    entry: 'server/worker.ts',
    logFile: path.join(logDir, `worker-${workers.length}.log`),
    env: {
      NODE_ENV: 'test',
      DATABASE_URL: t.deps.env.DATABASE_URL,
      JWT_SECRET: t.deps.env.JWT_SECRET,
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String(t.deps.env.SMTP_PORT),
      WORKER_THREADS: '1',
      ENGINE_THREAD_NICE: '0',
    },
  });
  workers.push(worker);
  return worker;
}

/** Polls the run until `done` says so; fails the test after `ms`. */
async function waitForRun(id: string, done: (row: RunRow) => boolean, ms: number) {
  const until = Date.now() + ms;
  for (;;) {
    const row = await getRunForJob(t.deps.db, { id });
    if (row && done(row)) return row;
    if (Date.now() > until) throw new Error(`run ${id} stayed ${row?.status} for ${ms} ms`);
    await sleep(200);
  }
}
type RunRow = NonNullable<Awaited<ReturnType<typeof getRunForJob>>>;
const heartbeatOf = (row: RunRow) =>
  (row.progress as { heartbeatAt?: string } | null)?.heartbeatAt ?? null;

describe('a worker killed during an estimation', () => {
  it('leaves a run that the sweep fails with a reason, and the next worker carries on', async () => {
    const first = startWorker();
    const slow = await team.agents.analyst
      .post(base)
      // Long enough to be killed mid-run on a fast machine too (tens of seconds on one thread).
      .send({ spec: mixedLogitSpec(10_000, 5, true) })
      .expect(201);
    const running = await waitForRun(
      slow.body.id,
      (r) => r.status !== 'queued' && heartbeatOf(r) !== null,
      60_000,
    );
    expect(running.status).toBe('running');

    await first.kill();
    await sleep(100);
    const afterKill = await getRunForJob(t.deps.db, { id: slow.body.id });
    await sleep(2_500); // more than two heartbeats
    const later = await getRunForJob(t.deps.db, { id: slow.body.id });
    expect(later?.status).toBe('running');
    expect(heartbeatOf(later!)).toBe(heartbeatOf(afterKill!));

    // Nobody sweeps it before it has been silent long enough…
    expect(await sweepStaleRuns(t.deps)).not.toContain(slow.body.id);
    // …and once it has (the clock moved on by STALE_RUN_MS), it is failed with the reason.
    const failed = await sweepStaleRuns(t.deps, Date.now() + STALE_RUN_MS);
    expect(failed).toContain(slow.body.id);
    const view = (await team.agents.viewer.get(`${base}/${slow.body.id}`).expect(200)).body;
    expect(view).toMatchObject({ status: 'failed', error: WORKER_LOST_ERROR });

    startWorker();
    const next = await team.agents.analyst
      .post(base)
      .send({
        spec: {
          model: 'mnl',
          coefficients: Object.keys(TRUE_MNL).map((column, k) => ({ name: `b${k}`, column })),
        },
      })
      .expect(201);
    const done = await waitForRun(
      next.body.id,
      (r) => r.status === 'done' || r.status === 'failed',
      90_000,
    );
    expect(done).toMatchObject({ status: 'done', error: null });
  }, 180_000);
});
