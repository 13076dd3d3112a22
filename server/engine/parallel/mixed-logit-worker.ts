/**
 * Piscina worker entry: holds the kernels of the respondent slices assigned to this thread
 * (data views over SharedArrayBuffers, draws generated here for the slice only) and answers
 * θ → (partial LL, gradient). Thin by design: validate the message, call the pure kernel.
 */
import { move } from 'piscina';
import type { ChoiceData } from '../estimation/choice-data';
import { createMixedLogitKernel, type MixedLogitKernel } from '../estimation/mixed-logit-kernel';
import { createMixedLogitLayout } from '../estimation/mixed-logit-layout';
import { createStandardVariates } from '../estimation/standard-variates';
import type { InitSliceMessage, SliceMessage, SliceResult } from './worker-messages';

const kernels = new Map<string, MixedLogitKernel>();

function initSlice(msg: InitSliceMessage): MixedLogitKernel {
  const data: ChoiceData = {
    columns: msg.columns,
    respondentIds: [],
    taskIds: [],
    taskStart: msg.taskStart,
    diffStart: msg.diffStart,
    diffs: msg.diffs,
    altCount: msg.altCount,
  };
  const layout = createMixedLogitLayout(
    data,
    msg.coefficients,
    msg.correlated,
    msg.wtpCost ?? null,
  );
  const variates = createStandardVariates(layout, msg.draws, msg.first, msg.count);
  return createMixedLogitKernel(data, layout, variates, msg.draws.count, msg.first, msg.count);
}

/** Handles one message; returns the slice's LL and gradient (and scores when asked). */
export function handleSliceMessage(msg: SliceMessage): SliceResult | null {
  if (!msg || typeof msg !== 'object' || typeof msg.key !== 'string')
    throw new TypeError('invalid worker message');
  if (msg.kind === 'init') {
    kernels.set(msg.key, initSlice(msg));
    return null;
  }
  if (msg.kind === 'release') {
    kernels.delete(msg.key);
    return null;
  }
  const kernel = kernels.get(msg.key);
  if (!kernel) throw new Error(`worker slice ${msg.key} was not initialised`);
  if (!(msg.theta instanceof Float64Array) || msg.theta.length !== kernel.parameterCount) {
    throw new TypeError('theta must be a Float64Array of the model parameter count');
  }
  const P = kernel.parameterCount;
  const withScores = msg.kind === 'scores';
  // One packed buffer [LL, gradient, scores?] moved (not copied) back to the caller.
  const packed = new Float64Array(1 + P + (withScores ? kernel.respondentCount * P : 0));
  packed[0] = kernel.evaluate(
    msg.theta,
    packed.subarray(1, 1 + P),
    withScores ? packed.subarray(1 + P) : null,
  );
  return move(packed) as SliceResult;
}
