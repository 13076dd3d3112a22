/** Polling for what a job, a worker or another process writes to the test database. */
import { getRunForJob } from '../../db/queries/runs';
import type { Db } from '../../db/client';

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** `probe` again every `everyMs` until it gives a value; throws after `ms` with `what()`. */
export async function waitFor<T>(
  probe: () => Promise<T | null | undefined> | T | null | undefined,
  ms: number,
  { everyMs = 200, what = () => 'nothing' }: { everyMs?: number; what?: () => string } = {},
): Promise<T> {
  const until = Date.now() + ms;
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (Date.now() > until) throw new Error(`${what()} after ${ms} ms`);
    await sleep(everyMs);
  }
}

export type RunRow = NonNullable<Awaited<ReturnType<typeof getRunForJob>>>;

/** The run's row once `done(row)` holds. */
export function waitForRun(
  db: Db,
  id: string,
  done: (row: RunRow) => boolean,
  ms: number,
  everyMs = 200,
): Promise<RunRow> {
  let last: RunRow | undefined | null;
  return waitFor(
    async () => {
      last = await getRunForJob(db, { id });
      return last && done(last) ? last : null;
    },
    ms,
    { everyMs, what: () => `run ${id} still ${last?.status}` },
  );
}
