/**
 * Where a multi-start mixed-logit fit stands: the starts already finished (each with its BFGS
 * result) and the BFGS state of the current one. fitMixedLogit reports one after every
 * iteration and, given one back, goes on from it; with the same data, draws and seed the
 * evaluations repeat bit for bit, so the fit ends where an uninterrupted one would (bfgs.ts).
 * What is kept, how often and where is the caller's choice (the estimation job stores it).
 */
import type { BfgsResult, BfgsState } from './bfgs';

export interface MixedLogitCheckpoint {
  /** The start (0-based) being optimised. */
  start: number;
  /** Results of the starts before `start`, in start order. */
  finished: BfgsResult[];
  /** The current start's state after its last iteration (null before its first). */
  current: BfgsState | null;
}

/** Iterations done over all starts at this checkpoint (what the run's progress shows). */
export function countCheckpointIterations(checkpoint: MixedLogitCheckpoint): number {
  return (
    checkpoint.finished.reduce((sum, r) => sum + r.iterations, 0) +
    (checkpoint.current?.iterations ?? 0)
  );
}

/** Throws when the checkpoint cannot belong to a fit of P parameters with `starts` starts. */
export function assertCheckpointFits(
  checkpoint: MixedLogitCheckpoint,
  P: number,
  starts: number,
): void {
  const sizes = [
    ...checkpoint.finished.map((r) => r.x.length),
    ...(checkpoint.current ? [checkpoint.current.x.length] : []),
  ];
  if (
    !Number.isInteger(checkpoint.start) ||
    checkpoint.start < 0 ||
    checkpoint.start >= starts ||
    checkpoint.finished.length !== checkpoint.start ||
    sizes.some((n) => n !== P)
  )
    throw new Error(
      `the saved estimation state does not fit this model (${P} parameters, ${starts} starts)`,
    );
}
