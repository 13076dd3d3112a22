/** A mixed-logit evaluator together with the kernel that runs it. */
import type { LoglikEvaluator } from '../estimation/loglik-evaluator';
import type { KernelKind } from '../simd/kernel-choice';

export interface MixedLogitEvaluator extends LoglikEvaluator {
  /** 'simd' only when every thread runs the WebAssembly SIMD kernel. */
  readonly kernel: KernelKind;
  /** Why SIMD was not used although it was wanted (to be logged); empty otherwise. */
  readonly notes: readonly string[];
  /** Bytes of the kernel arena (data, draws and workspaces). */
  readonly memoryBytes: number;
}
