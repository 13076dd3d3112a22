/** Messages between the estimator and the mixed-logit worker threads (validated in the worker). */
import type { DrawsSpec } from '../draws/uniform-draws';
import type { CoefficientSpec } from '../estimation/mixed-logit-layout';
import type { ArenaMemory } from '../simd/arena-kernel';
import type { ArenaPlan } from '../simd/arena-plan';
import type { KernelKind } from '../simd/kernel-choice';

export interface InitSliceMessage {
  kind: 'init';
  key: string;
  /** The arena's shared memory: data and variates are read in place, never copied. */
  memory: ArenaMemory;
  plan: ArenaPlan;
  sliceIndex: number;
  columns: string[];
  coefficients: CoefficientSpec[];
  correlated: boolean;
  draws: Omit<DrawsSpec, 'dimensions'>;
  kernel: KernelKind;
}

/** The worker's answer to init: the kernel it runs, and why if it had to fall back. */
export interface InitSliceResult {
  kernel: KernelKind;
  note: string | null;
}

export interface EvaluateSliceMessage {
  kind: 'evaluate' | 'scores';
  key: string;
  theta: Float64Array;
}

export interface ReleaseSliceMessage {
  kind: 'release';
  key: string;
}

export type SliceMessage = InitSliceMessage | EvaluateSliceMessage | ReleaseSliceMessage;

/**
 * A slice's answer, packed in one moved buffer: [LL, ∂LL/∂θ (P values), scores (count × P,
 * only for kind 'scores')].
 */
export type SliceResult = Float64Array;
