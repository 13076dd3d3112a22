/**
 * The respondent layer of the HB sampler: the current α_n and β_n = T(α_n) of every respondent,
 * their utilities v_n = D_n β_n and log-likelihoods, and one random-walk MH sweep over
 * respondents (Train 2009, §12.6; the proposal in random-walk-proposal.ts). The proposal's utilities are v_n + D_n(β' − β_n) over the
 * column-major blocks of respondent-design.ts, and ln P(y_n | β_n) of the current state is kept,
 * so a proposal costs one register-blocked pass over the respondent's rows and one exponential
 * per row, summed straight into the task's denominator; the sweep
 * allocates nothing. The kept utilities are updated by accepted increments, whose rounding
 * drifts by about √(accepted moves)·ε·|v| (≈ 1e-13 after 10⁵ moves), far below the MH noise.
 */
import type { StatefulPrng } from '../../../shared/engine/random/prng';
import type { Prng } from '../draws/prng';
import type { ChoiceData } from '../estimation/choice-data';
import { HB_LOGNORMAL, HB_NEG_LOGNORMAL, type HbLayout } from './check-hb-options';
import { createProposalWorkspace, proposeRandomWalk } from './random-walk-proposal';
import { buildRespondentDesign, shiftUtilities } from './respondent-design';
import { computeLoglikOfUtilities } from './respondent-logit-loglik';
import {
  createRespondentShiftKernel,
  type RespondentKernelPreference,
} from './respondent-shift-kernel';

/** The respondent layer as the chain (run-hb-chain.ts) and the fixed step (fixed-step.ts) use it. */
export interface IndividualStep {
  /** N × Kr current α_n (random coefficients). */
  readonly alpha: Float64Array;
  /** Which kernel computes the proposals' likelihoods (the previous layers leave it out). */
  readonly kernel?: 'simd' | 'simd-likelihood' | 'typescript';
  /** Kf current fixed coefficients. */
  readonly fixedAlpha: Float64Array;
  /**
   * One MH sweep over respondents at (μ, Σ = LLᵀ), `steps` proposals per respondent in a row
   * (default 1); returns how many proposals were accepted.
   */
  step(mu: Float64Array, L: Float64Array, rho: number, prng: Prng, steps?: number): number;
  /** Σ_n ln P(y_n | α_n, fixed = candidate), keeping the candidate for acceptFixed. */
  proposeFixed(candidate: Float64Array): number;
  /** Makes the last proposeFixed candidate the current fixed coefficients. */
  acceptFixed(): void;
  totalLoglik(): number;
  /** Writes β_n (random coefficients, transformed) of every respondent at `offset`. */
  writeBetas(out: Float32Array, offset: number): void;
}

export type IndividualStepFactory = (
  data: ChoiceData,
  layout: HbLayout,
  start: Float64Array,
  preference?: RespondentKernelPreference,
) => IndividualStep;

/** β of an α under a coefficient's transform. */
export function toBeta(transform: number, alpha: number): number {
  if (transform === HB_LOGNORMAL) return Math.exp(alpha);
  if (transform === HB_NEG_LOGNORMAL) return -Math.exp(alpha);
  return alpha;
}

/** State starts at α_n = start (random part) for every respondent. */
export function createIndividualStep(
  data: ChoiceData,
  layout: HbLayout,
  start: Float64Array,
  preference: RespondentKernelPreference = 'auto',
): IndividualStep {
  const { transform, random, fixed } = layout;
  const Kr = random.length;
  const Kf = fixed.length;
  const N = data.taskStart.length - 1;
  const { diffStart, taskStart } = data;
  const design = buildRespondentDesign(data, layout);
  const { rowStart } = design;
  const randomTransform = Int8Array.from(random, (k) => transform[k]);
  const kernel = createRespondentShiftKernel(data, design, Kr, Kf, preference, randomTransform);
  const { v, vNew, vFixed, delta, alpha, beta, ll } = kernel;
  for (let n = 0; n < N; n++)
    for (let r = 0; r < Kr; r++) {
      alpha[n * Kr + r] = start[random[r]];
      beta[n * Kr + r] = toBeta(randomTransform[r], start[random[r]]);
    }
  const fixedAlpha = Float64Array.from(fixed, (k) => start[k]);
  // Scratch, sized once.
  const proposalWs = createProposalWorkspace(Kr);
  const proposal = new Float64Array(Kr);
  const betaNew = new Float64Array(Kr);
  const candidate = new Float64Array(Kf);
  const llFixed = new Float64Array(N);

  for (let n = 0; n < N; n++) {
    const first = rowStart[n];
    const R = rowStart[n + 1] - first;
    shiftUtilities(v, first, kernel.random, Kr * first, beta.subarray(n * Kr), Kr, R, v, first);
    shiftUtilities(v, first, kernel.fixed, Kf * first, fixedAlpha, Kf, R, v, first);
    ll[n] = computeLoglikOfUtilities(v, first, diffStart, taskStart[n], taskStart[n + 1]);
  }

  /** One random-walk MH step of respondent n's α_n; true when the proposal is accepted. */
  const moveRespondent = (
    n: number,
    mu: Float64Array,
    L: Float64Array,
    rho: number,
    prng: Prng,
  ): boolean => {
    const o = n * Kr;
    const logPrior = proposeRandomWalk(alpha, o, mu, L, Kr, rho, prng, proposal, proposalWs);
    for (let r = 0; r < Kr; r++) {
      betaNew[r] = toBeta(randomTransform[r], proposal[r]);
      delta[r] = betaNew[r] - beta[o + r];
    }
    const llNew = kernel.shiftedLoglik(n, false);
    if (!(Math.log(prng.nextDouble()) < llNew - ll[n] + logPrior)) return false;
    for (let r = 0; r < Kr; r++) {
      alpha[o + r] = proposal[r];
      beta[o + r] = betaNew[r];
    }
    const first = rowStart[n];
    const R = rowStart[n + 1] - first;
    for (let i = 0; i < R; i++) v[first + i] = vNew[i];
    ll[n] = llNew;
    return true;
  };

  return {
    alpha,
    fixedAlpha,
    kernel: kernel.kind,
    step(mu, L, rho, prng, steps = 1) {
      // The kernel continues the generator's stream when it can take its state words.
      if (kernel.sweep && 'saveState' in prng && 'loadState' in prng)
        return kernel.sweep(steps, mu, L, rho, prng as StatefulPrng);
      let moved = 0;
      for (let n = 0; n < N; n++) {
        for (let repeat = 0; repeat < steps; repeat++)
          if (moveRespondent(n, mu, L, rho, prng)) moved++;
      }
      return moved;
    },
    proposeFixed(values) {
      candidate.set(values);
      for (let f = 0; f < Kf; f++) delta[f] = values[f] - fixedAlpha[f];
      let total = 0;
      for (let n = 0; n < N; n++) total += llFixed[n] = kernel.shiftedLoglik(n, true);
      return total;
    },
    acceptFixed() {
      fixedAlpha.set(candidate);
      v.set(vFixed);
      ll.set(llFixed);
    },
    totalLoglik() {
      let total = 0;
      for (let n = 0; n < N; n++) total += ll[n];
      return total;
    },
    writeBetas(out, offset) {
      for (let i = 0; i < N * Kr; i++) out[offset + i] = beta[i];
    },
  };
}
