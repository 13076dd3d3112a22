/** Chooses the evaluator: the in-process kernel for one thread, worker threads otherwise. */
import type { DrawsSpec } from '../draws/uniform-draws';
import type { ChoiceData } from '../estimation/choice-data';
import { createInProcessEvaluator, type LoglikEvaluator } from '../estimation/loglik-evaluator';
import { createMixedLogitKernel } from '../estimation/mixed-logit-kernel';
import type { MixedLogitLayout } from '../estimation/mixed-logit-layout';
import { createStandardVariates } from '../estimation/standard-variates';
import { createWorkerPoolEvaluator } from './worker-pool-evaluator';

/** Evaluator of the simulated panel LL over all respondents, on `threads` threads (≥ 1). */
export async function createLoglikEvaluator(
  data: ChoiceData,
  layout: MixedLogitLayout,
  draws: Omit<DrawsSpec, 'dimensions'>,
  threads: number,
): Promise<LoglikEvaluator> {
  const N = data.taskStart.length - 1;
  if (threads > 1 && N >= threads) return createWorkerPoolEvaluator(data, layout, draws, threads);
  const variates = createStandardVariates(layout, draws, 0, N);
  return createInProcessEvaluator(
    createMixedLogitKernel(data, layout, variates, draws.count, 0, N),
  );
}
