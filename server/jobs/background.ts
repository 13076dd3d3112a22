/**
 * Background services of a process: the job queue (design generation, estimation runs) and
 * periodic housekeeping. Job kinds register here as they are added: list them in `jobKinds`
 * (see server/jobs/queue.ts for what a kind is).
 */
import type { AppDeps } from '../deps';
import { startJobQueue, type RegisteredJobKind } from './queue';
import { createDesignJobKind } from './design-job';
import { createEstimationJobKind } from './estimation-job';
import { createMailJobKind } from './mail-job';
import { startCloseCheck } from '../services/lifecycle';

export type StopFn = () => Promise<void>;

/** Every job kind of the application. */
export function createJobKinds(): RegisteredJobKind[] {
  return [createDesignJobKind(), createEstimationJobKind(), createMailJobKind()];
}

/**
 * Starts the queue and makes `deps.jobs` available to request handlers (the same deps object
 * the app was created with). With embeddedWorker the process also runs the handlers.
 */
export async function startBackgroundServices(
  deps: AppDeps,
  opts: { embeddedWorker: boolean },
): Promise<StopFn> {
  const queue = await startJobQueue(deps, { kinds: createJobKinds(), work: opts.embeddedWorker });
  deps.jobs = queue;
  // Live studies close at their date or quota even when nobody is answering.
  const stopCloseCheck = startCloseCheck(deps);
  return async () => {
    stopCloseCheck();
    deps.jobs = undefined;
    await queue.stop();
  };
}
