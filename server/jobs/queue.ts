/**
 * The job queue: pg-boss on the application's own PostgreSQL (schema `pgboss`). Web processes
 * only send; worker processes (the embedded worker or `npm run worker`) also run handlers.
 *
 * A job kind is a name, a zod schema for its data, and a handler:
 *
 *   export const estimationJobKind = defineJobKind({
 *     name: 'estimation-run',
 *     schema: z.object({ runId: z.uuid() }),
 *     expireInMinutes: 120,
 *     handle: async (data, ctx) => { ... },       // ctx.deps, ctx.logger
 *     sweep: async (deps) => { ... },             // optional, every minute in workers
 *   });
 *
 * and is listed in server/jobs/background.ts. Handlers own their status rows (queued →
 * running → done/failed/cancelled); pg-boss never retries (a retry would repeat work the
 * user can restart), and `sweep` fails rows whose worker died.
 */
import PgBoss from 'pg-boss';
import type { z } from 'zod';
import type { AppDeps } from '../deps';
import type { SendOptions, SweepQueue } from './orphan-sweep';
import { transactionExecutor } from './transaction-executor';

export type JobContext = { deps: AppDeps; jobId: string };

export interface JobKind<T = unknown> {
  name: string;
  schema: z.ZodType<T>;
  /** Upper bound of one run; pg-boss expires it afterwards. */
  expireInMinutes: number;
  handle: (data: T, ctx: JobContext) => Promise<void>;
  /**
   * Housekeeping run every minute by workers: fail rows left running by a crash, queue again
   * rows whose message was lost (orphan-sweep.ts; needs the queue).
   */
  sweep?: (deps: AppDeps, queue?: SweepQueue) => Promise<void>;
  /** Called once when a worker stops (e.g. destroy thread pools). */
  close?: () => Promise<void>;
}

/** A job kind with its data type erased: data is parsed by the kind's own schema. */
export interface RegisteredJobKind {
  name: string;
  expireInMinutes: number;
  parse(data: unknown): object;
  handle(data: unknown, ctx: JobContext): Promise<void>;
  sweep?: (deps: AppDeps, queue?: SweepQueue) => Promise<void>;
  close?: () => Promise<void>;
}

export function defineJobKind<T extends object>(kind: JobKind<T>): RegisteredJobKind {
  return {
    name: kind.name,
    expireInMinutes: kind.expireInMinutes,
    parse: (data) => kind.schema.parse(data),
    handle: (data, ctx) => kind.handle(kind.schema.parse(data), ctx),
    sweep: kind.sweep,
    close: kind.close,
  };
}

/** What services use to enqueue work (tests substitute an in-process one). */
export interface JobSender {
  /**
   * Enqueues a job; with `tx`, inside that transaction, so the job exists exactly when the
   * row that records it does.
   */
  send(name: string, data: object, opts?: SendOptions): Promise<void>;
}

export interface JobQueue extends JobSender, SweepQueue {
  stop(): Promise<void>;
}

/** pg-boss's job states of a job that is still to run or running. */
const PENDING_STATES = ['created', 'retry', 'active'];

const SWEEP_MS = 60_000;

export async function startJobQueue(
  deps: AppDeps,
  opts: { kinds: RegisteredJobKind[]; work: boolean },
): Promise<JobQueue> {
  const boss = new PgBoss({
    connectionString: deps.env.DATABASE_URL,
    max: 4,
    application_name: 'choicewright-jobs',
    // Keep finished jobs a week; our own tables hold the results.
    deleteAfterDays: 7,
  });
  boss.on('error', (err) => deps.logger.error({ err }, 'job queue error'));
  await boss.start();
  const byName = new Map(opts.kinds.map((k) => [k.name, k]));
  for (const kind of byName.values())
    await boss.createQueue(kind.name, {
      name: kind.name,
      retryLimit: 0,
      expireInSeconds: kind.expireInMinutes * 60,
    });

  const send: JobSender['send'] = async (name, data, sendOpts) => {
    const kind = byName.get(name);
    if (!kind) throw new Error(`Unknown job kind ${name}`);
    await boss.send(name, kind.parse(data), {
      ...(sendOpts?.tx ? { db: transactionExecutor(sendOpts.tx) } : {}),
      ...(sendOpts?.startAfterSeconds ? { startAfter: sendOpts.startAfterSeconds } : {}),
    });
  };
  const pendingIds: SweepQueue['pendingIds'] = async (name, idField) => {
    const { rows } = await boss
      .getDb()
      .executeSql(
        `select data->>$2 as id from pgboss.job where name = $1 and state::text = any($3::text[])`,
        [name, idField, PENDING_STATES],
      );
    return new Set(rows.map((r: { id: string | null }) => r.id).filter((id) => id !== null));
  };
  const sweepQueue: SweepQueue = { send, pendingIds };

  let sweepTimer: NodeJS.Timeout | null = null;
  if (opts.work) {
    for (const kind of byName.values()) {
      await boss.work<unknown>(kind.name, { pollingIntervalSeconds: 1 }, async (jobs) => {
        for (const job of jobs) {
          await kind.handle(job.data, { deps, jobId: job.id });
        }
      });
    }
    const sweep = async () => {
      for (const kind of byName.values())
        await kind
          .sweep?.(deps, sweepQueue)
          .catch((err) => deps.logger.error({ err }, `sweep ${kind.name}`));
    };
    await sweep();
    sweepTimer = setInterval(() => void sweep(), SWEEP_MS);
    sweepTimer.unref();
  }

  return {
    send,
    pendingIds,
    async stop() {
      if (sweepTimer) clearInterval(sweepTimer);
      await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
      for (const kind of byName.values()) await kind.close?.();
    },
  };
}
