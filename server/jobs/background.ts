/**
 * Background services of a process: the job queue (design generation, estimation runs) and
 * periodic housekeeping. Job kinds register here as they are added.
 */
import type { AppDeps } from '../deps';

export type StopFn = () => Promise<void>;

export async function startBackgroundServices(
  _deps: AppDeps,
  _opts: { embeddedWorker: boolean },
): Promise<StopFn> {
  return async () => {};
}
