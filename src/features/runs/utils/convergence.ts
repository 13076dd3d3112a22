/** Words for a run's convergence verdict (server/engine/estimation/convergence.ts). */
import type { RunResult } from '@shared/schemas/run';

const statusWords: Record<string, string> = {
  converged: 'Converged',
  stalled: 'Stalled',
  iteration_limit: 'Iteration limit reached',
};

/** "Converged", "Stalled", … (older runs: their stored reason). */
export function describeConvergence(results: RunResult): string {
  const status = results.convergenceDetail?.status;
  if (status) return statusWords[status];
  return results.converged ? 'Converged' : `Not converged (${results.convergence.reason})`;
}
