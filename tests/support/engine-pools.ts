/**
 * Engine thread pools shared by a test file's jobs, as a worker process shares them
 * (server/jobs/estimation-job.ts, createEstimationJobKind). A job given no pool starts its own
 * thread, and each engine thread loads the engine (from its prebuilt bundle, about 0.15 s of
 * CPU; through the tsx loader when the bundle is stale, about 0.7 s), per run more than many of
 * the tests' small runs take to estimate.
 */
import { afterAll } from 'vitest';
import type { Piscina } from 'piscina';
import { createEstimationPool } from '../../server/engine/parallel/run-estimation-in-worker';
import { createDesignPool } from '../../server/engine/design/run-design-in-worker';

/** One estimation thread for the file's runs (at normal priority, as testEnv sets), ended after them. */
export function useEstimationPool(): Piscina {
  const pool = createEstimationPool({ nice: 0 });
  afterAll(() => pool.destroy());
  return pool;
}

/** One design thread for the file's design jobs, kept between jobs, ended after them. */
export function useDesignPool(): Piscina {
  const pool = createDesignPool({ maxThreads: 1, idleTimeoutMs: 60_000 });
  afterAll(() => pool.destroy());
  return pool;
}
