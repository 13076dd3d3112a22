/** Messages between the estimator and the mixed-logit worker threads (validated in the worker). */
import type { DrawsSpec } from '../draws/uniform-draws';
import type { CoefficientSpec, MixedLogitLayout } from '../estimation/mixed-logit-layout';
import type { KernelArena } from '../simd/kernel-arena';
import type { ArenaMemory } from '../simd/arena-kernel';
import type { ArenaPlan } from '../simd/arena-plan';
import type { KernelKind } from '../simd/kernel-choice';

/** What a worker needs to set up one slice of the arena. */
interface SliceSetup {
  key: string;
  /** The arena's shared memory: data and variates are read in place, never copied. */
  memory: ArenaMemory;
  plan: ArenaPlan;
  sliceIndex: number;
  columns: string[];
  coefficients: CoefficientSpec[];
  correlated: boolean;
  /** WTP space: name of the cost coefficient (null or absent in preference space). */
  wtpCost?: string | null;
  draws: Omit<DrawsSpec, 'dimensions'>;
  kernel: KernelKind;
}

/**
 * The setup of slice `sliceIndex` of an arena for a worker thread (the layout travels as its
 * specification; the worker builds its own).
 */
export function getSliceSetup(
  arena: KernelArena,
  sliceIndex: number,
  columns: readonly string[],
  layout: MixedLogitLayout,
): Omit<SliceSetup, 'key' | 'draws' | 'kernel'> {
  return {
    memory: arena.memory ?? arena.buffer,
    plan: arena.plan,
    sliceIndex,
    columns: [...columns],
    coefficients: layout.coefficients.map((c) => ({ ...c })),
    correlated: layout.correlated,
    wtpCost: layout.wtpCost >= 0 ? layout.coefficients[layout.wtpCost].name : null,
  };
}

/** Sets up a kernel for evaluations over one slice of the arena. */
export interface InitSliceMessage extends SliceSetup {
  kind: 'init';
}

/** Sets up a streaming taste-profile runner over one slice of the arena. */
export interface InitProfilesMessage extends SliceSetup {
  kind: 'profiles-init';
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

/** Packed taste profiles of respondents first..first+count−1 (profile-moments.ts layout). */
export interface ProfilesSliceMessage {
  kind: 'profiles';
  key: string;
  theta: Float64Array;
  first: number;
  count: number;
  /** Cost coefficient index, −1 for none. */
  cost: number;
}

export type SliceMessage =
  | InitSliceMessage
  | InitProfilesMessage
  | EvaluateSliceMessage
  | ReleaseSliceMessage
  | ProfilesSliceMessage;

/**
 * A slice's answer, packed in one moved buffer: [LL, ∂LL/∂θ (P values), scores (count × P,
 * only for kind 'scores')].
 */
export type SliceResult = Float64Array;
