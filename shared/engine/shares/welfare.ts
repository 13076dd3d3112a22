/**
 * Compensating variation of a scenario against the status quo by the log-sum formula
 * (Small & Rosen 1981, Econometrica 49:105–130; Train 2009, *Discrete Choice Methods with
 * Simulation*, 2nd ed., §3.5, eq. 3.10): with marginal utility of money α = −β_cost,
 *   CV_n = [ ln Σ_j exp(V_nj) − V_n,sq ] / α_n,
 * the money that would leave respondent n as well off with only the status quo available as
 * with the scenario's alternatives beside it. Positive: the scenario is worth that much to
 * them. For a model with taste variation it is computed per respondent from their own
 * coefficients and averaged. A respondent whose cost coefficient is not negative has no
 * money metric: their CV is NaN and left out of the average.
 * Browser-safe: typed arrays, no Node APIs.
 */

export interface WelfareInput {
  /** N respondents, K coefficients: betas is row-major N × K. */
  respondents: number;
  coefficients: number;
  betas: Float64Array;
  /** J alternatives of the scenario, row-major J × K, in the betas' column order. */
  alternativeCount: number;
  alternatives: Float64Array;
  /** Row of the status quo among the J alternatives. */
  baseline: number;
  /** Column of the cost coefficient. */
  cost: number;
}

export function assertWelfareInput(input: WelfareInput): void {
  const { respondents: N, coefficients: K, alternativeCount: J } = input;
  if (!(Number.isInteger(N) && N >= 1)) throw new RangeError('respondents must be positive');
  if (!(Number.isInteger(J) && J >= 2)) throw new RangeError('a scenario needs 2 alternatives');
  if (input.betas.length !== N * K) throw new RangeError('betas must hold N × K values');
  if (input.alternatives.length !== J * K)
    throw new RangeError('alternatives must hold J × K values');
  if (!(Number.isInteger(input.baseline) && input.baseline >= 0 && input.baseline < J))
    throw new RangeError('baseline must be one of the alternatives');
  if (!(Number.isInteger(input.cost) && input.cost >= 0 && input.cost < K))
    throw new RangeError('cost must be one of the coefficients');
}

/** CV per respondent (NaN where the cost coefficient is not negative). */
export function computeCompensatingVariation(input: WelfareInput): Float64Array {
  assertWelfareInput(input);
  const { respondents: N, coefficients: K, alternativeCount: J, betas, alternatives } = input;
  const out = new Float64Array(N);
  const v = new Float64Array(J);
  for (let n = 0; n < N; n++) {
    const b = n * K;
    const alpha = -betas[b + input.cost];
    if (!(alpha > 0)) {
      out[n] = NaN;
      continue;
    }
    let max = -Infinity;
    for (let j = 0; j < J; j++) {
      let u = 0;
      for (let k = 0; k < K; k++) u += alternatives[j * K + k] * betas[b + k];
      v[j] = u;
      if (u > max) max = u;
    }
    // Log-sum shifted by the largest utility so that no exponential overflows.
    let sum = 0;
    for (let j = 0; j < J; j++) sum += Math.exp(v[j] - max);
    out[n] = (max + Math.log(sum) - v[input.baseline]) / alpha;
  }
  return out;
}

/** Mean of the finite values and how many were left out. */
export function meanOfFinite(values: Float64Array): { mean: number; count: number; left: number } {
  let sum = 0;
  let count = 0;
  for (const x of values)
    if (Number.isFinite(x)) {
      sum += x;
      count++;
    }
  return { mean: count > 0 ? sum / count : NaN, count, left: values.length - count };
}
