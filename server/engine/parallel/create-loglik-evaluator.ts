/** Chooses the evaluator: the in-process kernel for one thread, worker threads otherwise. */
import type { DrawsSpec } from '../draws/uniform-draws';
import type { ChoiceData } from '../estimation/choice-data';
import { createInProcessEvaluator } from '../estimation/loglik-evaluator';
import type { MixedLogitLayout } from '../estimation/mixed-logit-layout';
import { createArenaKernel, getArenaSlice } from '../simd/arena-kernel';
import { createKernelArena } from '../simd/kernel-arena';
import { chooseKernel, type KernelPreference } from '../simd/kernel-choice';
import type { MixedLogitEvaluator } from './mixed-logit-evaluator';
import { createWorkerPoolEvaluator } from './worker-pool-evaluator';

/**
 * Evaluator of the simulated panel LL over all respondents, on `threads` threads (≥ 1), with
 * the WebAssembly SIMD kernel when `kernel` allows it and it can run here.
 */
export async function createLoglikEvaluator(
  data: ChoiceData,
  layout: MixedLogitLayout,
  draws: Omit<DrawsSpec, 'dimensions'>,
  threads: number,
  kernel: KernelPreference = 'auto',
): Promise<MixedLogitEvaluator> {
  const N = data.taskStart.length - 1;
  const choice = chooseKernel(kernel, layout);
  if (threads > 1 && N >= threads)
    return createWorkerPoolEvaluator(data, layout, draws, threads, choice);
  const arena = createKernelArena(data, layout, draws.count, [
    { first: 0, count: N, variateRespondents: N },
  ]);
  const made = createArenaKernel({
    ...getArenaSlice(arena, 0, { columns: data.columns, layout, draws, kind: choice.kind }),
    fillDraws: true,
  });
  return {
    ...createInProcessEvaluator(made.kernel),
    kernel: made.kind,
    notes: [choice.note, made.note].filter((n): n is string => !!n),
    memoryBytes: arena.plan.bytes,
  };
}
