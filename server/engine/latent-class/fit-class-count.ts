/**
 * Fits a C-class latent class logit from several starts and keeps the best (Train 2009, §14.3,
 * and common practice for EM's local maxima): each start perturbs the MNL estimates per class by
 * z·(2·SE + 0.2·|β|) with its own seeded stream, runs EM, and the best non-collapsed run has its
 * classes ordered by share (class 1 the largest, the others' membership parameters re-expressed
 * against it) and is polished by Newton-Raphson on the observed log-likelihood with the analytic
 * observed information (observed-information.ts), whose inverse is the covariance.
 */
import { drawStandardNormal } from '../draws/gamma-variate';
import { createPrng } from '../draws/prng';
import type { ChoiceData } from '../estimation/choice-data';
import type { MnlResult } from '../estimation/fit-mnl';
import { invertMatrix } from '../linalg/invert-matrix';
import {
  computePosteriors,
  createLatentClassState,
  type LatentClassState,
} from './latent-class-state';
import {
  computeObservedDerivatives,
  getParameterCount,
  getTheta,
  setTheta,
} from './observed-information';
import { runEm, type EmOutcome } from './run-em';
import {
  findRunOffMembership,
  invertInformationWithout,
  type RunOffCoefficient,
} from './membership-separation';

export interface ClassCountFit {
  C: number;
  /** Best state, or null when every start collapsed. */
  state: LatentClassState | null;
  /**
   * P × P inverse observed information at the best state (null if singular); the rows and
   * columns of run-off membership coefficients are NaN (membership-separation.ts).
   */
  covariance: Float64Array | null;
  /** Membership coefficients that ran off (quasi-separation). */
  runOff: RunOffCoefficient[];
  starts: { loglik: number; iterations: number; converged: boolean; collapsed: string | null }[];
  /** LL at which the best start's EM stopped (before the Newton polish). */
  bestStartLoglik: number;
  /** LL trace of the best start's EM run, and whether that run converged. */
  trace: number[];
  converged: boolean;
  /** Why no start could be used. */
  reason: string | null;
}

const POLISH_STEPS = 20;

export function fitClassCount(
  data: ChoiceData,
  z: Float64Array,
  Mp: number,
  C: number,
  mnl: MnlResult,
  options: { starts: number; maxIterations: number; tolerance: number; seed: number },
  membershipNames: readonly string[],
  hooks: { onStart?: (start: number) => void; shouldStop?: () => boolean } = {},
): ClassCountFit {
  const K = mnl.estimates.length;
  const N = data.taskStart.length - 1;
  let best: { state: LatentClassState; outcome: EmOutcome } | null = null;
  const starts: ClassCountFit['starts'] = [];
  // One class has one solution (the MNL): a single start.
  for (let s = 0; s < (C === 1 ? 1 : options.starts); s++) {
    hooks.onStart?.(s + 1);
    const state = createLatentClassState(N, C, K, Mp);
    const prng = createPrng(options.seed, 0x4c43_00 + C * 128 + s);
    for (let c = 0; c < C; c++)
      for (let k = 0; k < K; k++) {
        const b = mnl.estimates[k];
        const se = Number.isFinite(mnl.se[k]) ? mnl.se[k] : 0.1;
        state.betas[c * K + k] =
          C === 1 ? b : b + drawStandardNormal(prng) * (2 * se + 0.2 * Math.abs(b));
      }
    const outcome = runEm(data, z, state, options, hooks.shouldStop);
    starts.push({
      loglik: state.loglik,
      iterations: outcome.iterations,
      converged: outcome.converged,
      collapsed: outcome.collapsed,
    });
    if (
      !outcome.collapsed &&
      Number.isFinite(state.loglik) &&
      (!best || state.loglik > best.state.loglik)
    )
      best = { state, outcome };
  }
  if (!best)
    return {
      C,
      state: null,
      covariance: null,
      runOff: [],
      starts,
      bestStartLoglik: NaN,
      trace: [],
      converged: false,
      reason: `every start failed: ${starts.find((s) => s.collapsed)?.collapsed ?? 'no usable solution'}`,
    };
  const state = best.state;
  const bestStartLoglik = state.loglik;
  orderClassesByShare(data, z, state);
  const hess = polish(data, z, state);
  const runOff = findRunOffMembership(state, z, N, membershipNames);
  const covariance = invertInformationWithout(
    hess,
    getParameterCount(state),
    runOff.map((r) => r.parameter),
  );
  return {
    C,
    state,
    covariance,
    runOff,
    starts,
    bestStartLoglik,
    trace: best.outcome.trace,
    converged: best.outcome.converged,
    reason: null,
  };
}

/** Relabels classes by descending mean prior share; γ is re-expressed against the new class 1. */
function orderClassesByShare(data: ChoiceData, z: Float64Array, state: LatentClassState): void {
  const { C, K, Mp, pi } = state;
  const N = data.taskStart.length - 1;
  const share = Array.from({ length: C }, (_, c) => {
    let s = 0;
    for (let n = 0; n < N; n++) s += pi[n * C + c];
    return s;
  });
  const order = share.map((_, c) => c).sort((a, b) => share[b] - share[a]);
  const betas = Float64Array.from(state.betas);
  const full = new Float64Array(C * Mp); // γ with the reference class's zero row included
  full.set(state.gamma, Mp);
  order.forEach((from, to) => {
    state.betas.set(betas.subarray(from * K, (from + 1) * K), to * K);
    if (to > 0)
      for (let m = 0; m < Mp; m++)
        state.gamma[(to - 1) * Mp + m] = full[from * Mp + m] - full[order[0] * Mp + m];
  });
  computePosteriors(data, z, state);
}

/** Newton steps on the observed LL (never lowering it); returns the Hessian at the end. */
function polish(data: ChoiceData, z: Float64Array, state: LatentClassState): Float64Array {
  const P = getParameterCount(state);
  let { grad, hess } = computeObservedDerivatives(data, z, state);
  for (let it = 0; it < POLISH_STEPS; it++) {
    const inv = invertMatrix(
      hess.map((x) => -x),
      P,
    );
    // Singular (e.g. a run-off membership coefficient): no Newton step; the caller inverts what
    // it can.
    if (!inv) break;
    const step = new Float64Array(P);
    let decrement = 0;
    for (let a = 0; a < P; a++) {
      for (let b = 0; b < P; b++) step[a] += inv[a * P + b] * grad[b];
      decrement += step[a] * grad[a];
    }
    if (!(decrement > 1e-12)) break;
    const theta = getTheta(state);
    const before = state.loglik;
    let moved = false;
    for (let lambda = 1; lambda > 1e-6 && !moved; lambda /= 2) {
      setTheta(
        state,
        theta.map((x, p) => x + lambda * step[p]),
      );
      moved = computePosteriors(data, z, state) >= before;
    }
    if (!moved) {
      setTheta(state, theta);
      computePosteriors(data, z, state);
      break;
    }
    ({ grad, hess } = computeObservedDerivatives(data, z, state));
  }
  return hess;
}
