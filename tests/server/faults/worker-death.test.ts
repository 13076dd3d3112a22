/**
 * Worker death, with real processes: a separate worker (`npm run worker`, server/worker.ts)
 * takes a mixed logit from the real queue and is killed with SIGKILL in the middle of it,
 * after it saved a checkpoint, as an out-of-memory kill would. The run stops beating; once it
 * has been silent for STALE_RUN_MS the sweep queues it again, so it is never left "running"
 * for ever; a worker started afterwards resumes it from the checkpoint, says so, and ends it
 * with the estimates of the same specification run without interruption (same draws, seed and
 * thread count: the same floating-point path, so equal).
 */
import { afterAll, describe, expect, it } from 'vitest';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { useTestApp } from '../../support/test-app';
import { sleep, waitFor, waitForRun, type RunRow } from '../../support/wait-for';
import { getRunForJob } from '../../../db/queries/runs';
import { getRunCheckpoint } from '../../../db/queries/run-checkpoints';
import { STALE_RUN_MS, sweepStaleRuns } from '../../../server/jobs/stale-run-sweep';
import { startProcess, type ServerProcess } from '../../../scripts/lib/server-process';
import { mixedLogitSpec, useRunStudy } from '../jobs/run-fixtures';

// The API enqueues on the real queue; only the worker processes take jobs from it.
const t = useTestApp({}, { signIn: 'team', jobQueue: { work: false } });
const workers: ServerProcess[] = [];
const logDir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-worker-death-'));

const study = useRunStudy(t, 120, 60_000);

afterAll(async () => {
  for (const w of workers) await w.stop(5_000);
  fs.rmSync(logDir, { recursive: true, force: true });
});

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
      // A checkpoint after every iteration, so that a short run can be killed after one.
      RUN_CHECKPOINT_EVERY_MS: '0',
    },
  });
  workers.push(worker);
  return worker;
}

const heartbeatOf = (row: RunRow) =>
  (row.progress as { heartbeatAt?: string } | null)?.heartbeatAt ?? null;

describe('a worker killed during an estimation', () => {
  it('leaves a run that the sweep queues again and the next worker resumes from its checkpoint', async () => {
    const first = startWorker();
    // Long enough to be killed mid-run, after its first iteration, on a fast machine too (some
    // seconds on one thread: about 40 iterations over three starts); the checkpoint is looked
    // for every 50 ms, so the kill comes within an iteration or two of it.
    const spec = mixedLogitSpec(1_000, 5, true);
    const slow = await t.team.agents.analyst.post(study.base).send({ spec }).expect(201);
    const saved = await waitFor(
      () => getRunCheckpoint(t.deps.db, { runId: slow.body.id }),
      120_000,
      { everyMs: 50 },
    );
    expect(saved.attempt).toBe(1);

    await first.kill();
    await sleep(100);
    const afterKill = await getRunForJob(t.deps.db, { id: slow.body.id });
    const checkpoint = await getRunCheckpoint(t.deps.db, { runId: slow.body.id });
    await sleep(2_500); // more than two heartbeats
    const later = await getRunForJob(t.deps.db, { id: slow.body.id });
    expect(later?.status).toBe('running');
    expect(heartbeatOf(later!)).toBe(heartbeatOf(afterKill!));

    // Nobody sweeps it before it has been silent long enough…
    expect((await sweepStaleRuns(t.deps)).resumed).not.toContain(slow.body.id);
    // …and once it has (the clock moved on by STALE_RUN_MS), it is queued again.
    const swept = await sweepStaleRuns(t.deps, Date.now() + STALE_RUN_MS);
    expect(swept.resumed).toContain(slow.body.id);
    const waiting = (await t.team.agents.viewer.get(`${study.base}/${slow.body.id}`).expect(200))
      .body;
    expect(waiting).toMatchObject({ status: 'queued', attempts: 1 });

    startWorker();
    const resumed = await waitForRun(
      t.deps.db,
      slow.body.id,
      (r) => r.status === 'done' || r.status === 'failed',
      240_000,
    );
    expect(resumed).toMatchObject({ status: 'done', error: null, attempts: 2 });
    expect(resumed.progress).toMatchObject({
      resumed: { attempt: 2, fromIteration: checkpoint!.iteration },
    });
    expect(checkpoint!.iteration).toBeGreaterThan(0);

    // The same specification, never interrupted, on the same worker settings.
    const whole = await t.team.agents.analyst.post(study.base).send({ spec }).expect(201);
    const reference = await waitForRun(
      t.deps.db,
      whole.body.id,
      (r) => r.status === 'done' || r.status === 'failed',
      240_000,
    );
    expect(reference).toMatchObject({ status: 'done', attempts: 1 });
    type Stored = { estimates: unknown[]; loglik: number; iterations: number };
    const a = reference.results as Stored;
    const b = resumed.results as Stored;
    expect(b.estimates).toEqual(a.estimates);
    expect(b.loglik).toBe(a.loglik);
    expect(b.iterations).toBe(a.iterations);
  }, 420_000);
});
