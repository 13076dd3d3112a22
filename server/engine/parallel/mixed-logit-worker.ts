/**
 * Piscina worker entry: holds the kernels of the respondent slices assigned to this thread
 * (over the kernel arena's shared memory; the slice's draws are generated here, into the
 * arena) and answers θ → (partial LL, gradient), or θ → packed taste profiles of a range of
 * respondents. Thin by design: validate the message, call the pure kernel.
 */
import { move } from 'piscina';
import type { MixedLogitKernel } from '../estimation/mixed-logit-kernel';
import { createMixedLogitLayout } from '../estimation/mixed-logit-layout';
import { getProfileWidth } from '../estimation/profile-moments';
import { createArenaKernel } from '../simd/arena-kernel';
import { createProfileRunner, type ProfileRunner } from '../simd/profile-runner';
import type {
  InitProfilesMessage,
  InitSliceMessage,
  InitSliceResult,
  ProfilesSliceMessage,
  SliceMessage,
  SliceResult,
} from './worker-messages';

const kernels = new Map<string, MixedLogitKernel>();
const profileRunners = new Map<string, { runner: ProfileRunner; K: number }>();

function initSlice(msg: InitSliceMessage | InitProfilesMessage): InitSliceResult {
  if (!(msg.memory instanceof WebAssembly.Memory || msg.memory instanceof SharedArrayBuffer))
    throw new TypeError('init needs the arena memory');
  if (!msg.plan?.slices?.[msg.sliceIndex]) throw new TypeError('init names no slice of the arena');
  const layout = createMixedLogitLayout(
    { columns: msg.columns },
    msg.coefficients,
    msg.correlated,
    msg.wtpCost ?? null,
  );
  const params = {
    memory: msg.memory,
    plan: msg.plan,
    sliceIndex: msg.sliceIndex,
    columns: msg.columns,
    layout,
    draws: msg.draws,
    kind: msg.kernel,
  };
  if (msg.kind === 'profiles-init') {
    const runner = createProfileRunner(params);
    profileRunners.set(msg.key, { runner, K: layout.K });
    return { kernel: runner.kind, note: runner.note };
  }
  const made = createArenaKernel({ ...params, fillDraws: true });
  kernels.set(msg.key, made.kernel);
  return { kernel: made.kind, note: made.note };
}

function runProfiles(msg: ProfilesSliceMessage): Float64Array {
  const entry = profileRunners.get(msg.key);
  if (!entry) throw new Error(`worker slice ${msg.key} was not initialised`);
  if (!(msg.theta instanceof Float64Array)) throw new TypeError('theta must be a Float64Array');
  const out = new Float64Array(msg.count * getProfileWidth(entry.K));
  entry.runner.run(msg.theta, msg.first, msg.count, msg.cost, out, 0);
  return move(out) as Float64Array;
}

/** Handles one message; returns the slice's LL and gradient (and scores when asked). */
export function handleSliceMessage(msg: SliceMessage): SliceResult | InitSliceResult | null {
  if (!msg || typeof msg !== 'object' || typeof msg.key !== 'string')
    throw new TypeError('invalid worker message');
  if (msg.kind === 'init' || msg.kind === 'profiles-init') return initSlice(msg);
  if (msg.kind === 'release') {
    kernels.delete(msg.key);
    profileRunners.delete(msg.key);
    return null;
  }
  if (msg.kind === 'profiles') return runProfiles(msg);
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
