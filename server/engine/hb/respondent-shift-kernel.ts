/**
 * The inner kernel of the HB respondent layer: for respondent n, the utilities after a change δ of
 * its coefficients, u = v_n + D_n δ (the random or the fixed columns' block of
 * respondent-design.ts), and ln P(y_n | u) = −Σ_t ln(1 + Σ_{i∈t} e^{u_i}) (Train 2009, eq. 3.6).
 * Two implementations with the same arithmetic, so the chain is the same draw for draw whichever
 * runs: the WebAssembly SIMD kernel (simd/assembly/hb-respondent.ts) over one memory holding the
 * design blocks and utilities, or the TypeScript loops (shiftUtilities, computeLoglikOfUtilities).
 * The caller reads and writes the arrays below (they are views into the WebAssembly memory when
 * that kernel runs) and calls shiftedLoglik; nothing is allocated per call.
 */
import type { StatefulPrng } from '../../../shared/engine/random/prng';
import type { ChoiceData } from '../estimation/choice-data';
import { expTang } from '../linalg/exp-stream';
import { loadSimdKernelModule } from '../simd/simd-kernel-module';
import { createSimdKernel } from './respondent-simd-kernel';
import type { RespondentDesign } from './respondent-design';
import { shiftUtilities } from './respondent-design';

/**
 * 'auto': the WebAssembly kernel, whole MH sweeps in it (respondent-simd-kernel.ts) where it
 * runs; 'likelihood': the WebAssembly kernel for the proposals' likelihoods only, the proposal and
 * the acceptance in TypeScript (the previous layer, kept for the benchmark); 'typescript'.
 */
export type RespondentKernelPreference = 'auto' | 'likelihood' | 'typescript';

/**
 * One MH sweep over all respondents in the kernel (`steps` proposals each) at (μ, L = chol Σ, ρ),
 * continuing the stream of `prng` (left where the TypeScript step would leave it); returns the
 * accepted count.
 */
export type RespondentSweep = (
  steps: number,
  mu: Float64Array,
  L: Float64Array,
  rho: number,
  prng: StatefulPrng,
) => number;

export interface RespondentShiftKernel {
  kind: 'simd' | 'simd-likelihood' | 'typescript';
  /** The sampler's state: N × Kr α_n and β_n, and N current ln P(y_n | β_n). */
  alpha: Float64Array;
  beta: Float64Array;
  ll: Float64Array;
  /** Whole sweeps in the kernel (null: the caller proposes and accepts, calling shiftedLoglik). */
  sweep: RespondentSweep | null;
  /** The design blocks (copies of `design`'s). */
  random: Float64Array;
  fixed: Float64Array;
  /** Current utilities of every row; utilities with a fixed-coefficient candidate. */
  v: Float64Array;
  vFixed: Float64Array;
  /** The proposal's utilities of the respondent last shifted with `fixed` false (from 0). */
  vNew: Float64Array;
  /** δ: the change of the random (or fixed) coefficients. */
  delta: Float64Array;
  /** After shiftedLoglik: e^{u_i} of the respondent's rows (from 0) and each task's denominator. */
  exps: Float64Array;
  denominators: Float64Array;
  /**
   * u = v_n + D_n δ into vNew[0..R) (random columns) or into vFixed at the respondent's rows
   * (fixed columns); returns ln P(y_n | u).
   */
  shiftedLoglik(n: number, fixed: boolean): number;
}

/** Denominators whose product passes this move to the log scale (as computeLoglikOfUtilities). */
const FLUSH = 1e250;

/**
 * `transform`: the HB_* code of each random coefficient (the sweep's β = T(α); default all
 * normal, for callers that only shift utilities).
 */
export function createRespondentShiftKernel(
  data: ChoiceData,
  design: RespondentDesign,
  Kr: number,
  Kf: number,
  preference: RespondentKernelPreference = 'auto',
  transform: Int8Array = new Int8Array(Kr),
): RespondentShiftKernel {
  const module = preference !== 'typescript' ? loadSimdKernelModule().module : null;
  if (module) {
    try {
      return createSimdKernel(module, { data, design, Kr, Kf, transform }, preference === 'auto');
    } catch {
      // No shared WebAssembly memory here (or not this large): the TypeScript kernel, same chain.
    }
  }
  return createTypeScriptKernel({ data, design, Kr, Kf, transform });
}

/** What both kernels are built from: the data, their design blocks and the column counts. */
export interface KernelInput {
  data: ChoiceData;
  design: RespondentDesign;
  Kr: number;
  Kf: number;
  transform: Int8Array;
}

function createTypeScriptKernel({ data, design, Kr, Kf }: KernelInput): RespondentShiftKernel {
  const { rowStart, maxRows } = design;
  const { diffStart, taskStart } = data;
  const rows = rowStart[rowStart.length - 1];
  const v = new Float64Array(rows);
  const vNew = new Float64Array(maxRows);
  const vFixed = Kf > 0 ? new Float64Array(rows) : v;
  const delta = new Float64Array(Math.max(Kr, Kf));
  const exps = new Float64Array(maxRows);
  const denominators = new Float64Array(getMaxTasks(taskStart));
  const N = rowStart.length - 1;
  return {
    kind: 'typescript',
    alpha: new Float64Array(N * Kr),
    beta: new Float64Array(N * Kr),
    ll: new Float64Array(N),
    sweep: null,
    random: design.random,
    fixed: design.fixed,
    v,
    vFixed,
    vNew,
    delta,
    exps,
    denominators,
    shiftedLoglik(n, fixed) {
      const first = rowStart[n];
      const R = rowStart[n + 1] - first;
      const [block, C, u, offset] = fixed
        ? [design.fixed, Kf, vFixed, first]
        : [design.random, Kr, vNew, 0];
      shiftUtilities(v, first, block, C * first, delta, C, R, u, offset);
      // The arithmetic of computeLoglikOfUtilities (respondent-logit-loglik.ts), keeping the
      // exponentials and denominators.
      const firstTask = taskStart[n];
      const T = taskStart[n + 1] - firstTask;
      let i = 0;
      for (let t = 0; t < T; t++) {
        let denominator = 1;
        for (const end = diffStart[firstTask + t + 1] - first; i < end; i++)
          denominator += exps[i] = expTang(u[offset + i]);
        denominators[t] = denominator;
      }
      return sumLogDenominators(denominators, T);
    },
  };
}

export function getMaxTasks(taskStart: Int32Array): number {
  let max = 1;
  for (let n = 0; n + 1 < taskStart.length; n++)
    max = Math.max(max, taskStart[n + 1] - taskStart[n]);
  return max;
}

/**
 * −Σ_t ln d_t as computeLoglikOfUtilities takes it: products of denominators, one Math.log per
 * 1e250 of product, so both kernels give the bits of the previous layer.
 */
export function sumLogDenominators(den: Float64Array, T: number): number {
  let ll = 0;
  let product = 1;
  for (let t = 0; t < T; t++) {
    product *= den[t];
    if (product > FLUSH) {
      ll -= Math.log(product);
      product = 1;
    }
  }
  return ll - Math.log(product);
}
