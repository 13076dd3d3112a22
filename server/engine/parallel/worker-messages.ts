/** Messages between the estimator and the mixed-logit worker threads (validated in the worker). */
import type { DrawsSpec } from '../draws/uniform-draws';
import type { CoefficientSpec } from '../estimation/mixed-logit-layout';

export interface InitSliceMessage {
  kind: 'init';
  key: string;
  columns: string[];
  /** Views over SharedArrayBuffers: shared with the worker, never copied. */
  taskStart: Int32Array;
  diffStart: Int32Array;
  diffs: Float64Array;
  altCount: Int32Array;
  coefficients: CoefficientSpec[];
  correlated: boolean;
  /** WTP space: name of the cost coefficient (null or absent in preference space). */
  wtpCost?: string | null;
  draws: Omit<DrawsSpec, 'dimensions'>;
  first: number;
  count: number;
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
