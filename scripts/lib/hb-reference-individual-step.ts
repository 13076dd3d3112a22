/**
 * The HB sampler's first respondent layer, kept as the independent reference of the current one
 * (server/engine/hb/individual-step.ts) in tests/engine/hb/individual-step.test.ts: the same MH
 * sweep and the same draw stream (Train 2009, §12.6), with each proposal's β written into a
 * K-vector and its log-likelihood recomputed from the row-major data, one dot product per row.
 * It takes one MH step per respondent per iteration (it ignores `steps`).
 */
import type { Prng } from '../../server/engine/draws/prng';
import type { ChoiceData } from '../../server/engine/estimation/choice-data';
import type { HbLayout } from '../../server/engine/hb/check-hb-options';
import { toBeta, type IndividualStep } from '../../server/engine/hb/individual-step';
import {
  createProposalWorkspace,
  proposeRandomWalk,
} from '../../server/engine/hb/random-walk-proposal';
import {
  computeRespondentLoglik,
  getMaxRespondentRows,
} from '../../server/engine/hb/respondent-logit-loglik';

/** State starts at α_n = start (random part) for every respondent. */
export function createReferenceIndividualStep(
  data: ChoiceData,
  layout: HbLayout,
  start: Float64Array,
): IndividualStep {
  const { K, transform, random, fixed } = layout;
  const Kr = random.length;
  const Kf = fixed.length;
  const N = data.taskStart.length - 1;
  const { diffs, diffStart, taskStart } = data;
  const alpha = new Float64Array(N * Kr);
  for (let n = 0; n < N; n++) for (let r = 0; r < Kr; r++) alpha[n * Kr + r] = start[random[r]];
  const fixedAlpha = Float64Array.from(fixed, (k) => start[k]);
  const ll = new Float64Array(N);
  const beta = new Float64Array(K);
  const proposalWs = createProposalWorkspace(Kr);
  const proposal = new Float64Array(Kr);
  const work = new Float64Array(getMaxRespondentRows(data));
  const randomTransform = Int8Array.from(random, (k) => transform[k]);
  const candidate = new Float64Array(Kf);
  const llCandidate = new Float64Array(N);

  const setFixed = (values: Float64Array) => {
    for (let f = 0; f < Kf; f++) beta[fixed[f]] = values[f];
  };
  const setRandom = (values: Float64Array, offset: number) => {
    for (let r = 0; r < Kr; r++) beta[random[r]] = toBeta(randomTransform[r], values[offset + r]);
  };
  const loglikOf = (n: number) =>
    computeRespondentLoglik(diffs, diffStart, taskStart, n, K, beta, 0, work);

  setFixed(fixedAlpha);
  for (let n = 0; n < N; n++) {
    setRandom(alpha, n * Kr);
    ll[n] = loglikOf(n);
  }

  return {
    alpha,
    fixedAlpha,
    /** One MH sweep over respondents at (μ, Σ = LLᵀ); returns how many moved. */
    step(mu: Float64Array, L: Float64Array, rho: number, prng: Prng): number {
      let moved = 0;
      setFixed(fixedAlpha);
      for (let n = 0; n < N; n++) {
        const o = n * Kr;
        const logPrior = proposeRandomWalk(alpha, o, mu, L, Kr, rho, prng, proposal, proposalWs);
        setRandom(proposal, 0);
        const llNew = loglikOf(n);
        const logRatio = llNew - ll[n] + logPrior;
        if (Math.log(prng.nextDouble()) < logRatio) {
          alpha.set(proposal, o);
          ll[n] = llNew;
          moved++;
        }
      }
      return moved;
    },
    proposeFixed(values: Float64Array): number {
      candidate.set(values);
      setFixed(candidate);
      let total = 0;
      for (let n = 0; n < N; n++) {
        setRandom(alpha, n * Kr);
        total += llCandidate[n] = loglikOf(n);
      }
      setFixed(fixedAlpha);
      return total;
    },
    acceptFixed(): void {
      fixedAlpha.set(candidate);
      ll.set(llCandidate);
    },
    totalLoglik(): number {
      let total = 0;
      for (let n = 0; n < N; n++) total += ll[n];
      return total;
    },
    /** Writes β_n (random coefficients, transformed) of every respondent at `offset`. */
    writeBetas(out: Float32Array, offset: number): void {
      for (let n = 0; n < N; n++)
        for (let r = 0; r < Kr; r++)
          out[offset + n * Kr + r] = toBeta(randomTransform[r], alpha[n * Kr + r]);
    },
  };
}
