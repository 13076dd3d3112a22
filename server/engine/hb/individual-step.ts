/**
 * The respondent layer of the HB sampler: the current α_n of every respondent, their
 * log-likelihoods, and one random-walk MH sweep over respondents. With w = L⁻¹(α_n − μ)
 * (L = chol Σ) the proposal α' = α_n + ρLz has L⁻¹(α' − μ) = w + ρz, so each respondent needs one
 * triangular solve for both prior terms (Train 2009, §12.6; the identity is plain algebra).
 */
import { drawStandardNormal } from '../draws/gamma-variate';
import type { Prng } from '../draws/prng';
import type { ChoiceData } from '../estimation/choice-data';
import { solveLower } from '../linalg/triangular';
import { HB_LOGNORMAL, HB_NEG_LOGNORMAL, type HbLayout } from './check-hb-options';
import { computeRespondentLoglik, getMaxRespondentRows } from './respondent-logit-loglik';

export type IndividualStep = ReturnType<typeof createIndividualStep>;

/** β of an α under a coefficient's transform. */
export function toBeta(transform: number, alpha: number): number {
  if (transform === HB_LOGNORMAL) return Math.exp(alpha);
  if (transform === HB_NEG_LOGNORMAL) return -Math.exp(alpha);
  return alpha;
}

/** State starts at α_n = start (random part) for every respondent. */
export function createIndividualStep(data: ChoiceData, layout: HbLayout, start: Float64Array) {
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
  const w = new Float64Array(Kr);
  const z = new Float64Array(Kr);
  const proposal = new Float64Array(Kr);
  const work = new Float64Array(getMaxRespondentRows(data));
  const randomTransform = Int8Array.from(random, (k) => transform[k]);

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
    ll,
    /** One MH sweep over respondents at (μ, Σ = LLᵀ); returns how many moved. */
    step(mu: Float64Array, L: Float64Array, rho: number, prng: Prng): number {
      let moved = 0;
      setFixed(fixedAlpha);
      for (let n = 0; n < N; n++) {
        const o = n * Kr;
        for (let r = 0; r < Kr; r++) {
          proposal[r] = alpha[o + r] - mu[r];
          z[r] = drawStandardNormal(prng);
        }
        solveLower(L, Kr, proposal, 0, w);
        let qOld = 0;
        let qNew = 0;
        for (let r = 0; r < Kr; r++) {
          qOld += w[r] * w[r];
          const wNew = w[r] + rho * z[r];
          qNew += wNew * wNew;
          let step = 0;
          for (let j = 0; j <= r; j++) step += L[r * Kr + j] * z[j];
          proposal[r] = alpha[o + r] + rho * step;
        }
        setRandom(proposal, 0);
        const llNew = loglikOf(n);
        const logRatio = llNew - ll[n] - 0.5 * (qNew - qOld);
        if (Math.log(prng.nextDouble()) < logRatio) {
          alpha.set(proposal, o);
          ll[n] = llNew;
          moved++;
        }
      }
      return moved;
    },
    /** ln P(y_n | α_n, fixed = candidate) for every respondent into `out`; returns the sum. */
    loglikWithFixed(candidate: Float64Array, out: Float64Array): number {
      setFixed(candidate);
      let total = 0;
      for (let n = 0; n < N; n++) {
        setRandom(alpha, n * Kr);
        total += out[n] = loglikOf(n);
      }
      setFixed(fixedAlpha);
      return total;
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
