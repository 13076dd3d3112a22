/** Input of the share simulator and the checks run before any numerics. */

export interface ShareSimulationInput {
  /** N: respondents. */
  respondents: number;
  /** K: coefficients (coded columns). */
  coefficients: number;
  /** D: coefficient vectors per respondent (1 = point estimates); default 1. */
  drawsPerRespondent?: number;
  /** Row-major N × D × K coefficient values. */
  betas: Float64Array;
  /** Weights of each respondent's D vectors (N × D, each row sums to 1); default 1/D. */
  drawWeights?: Float64Array;
  /** J: alternatives in the scenario (at least 2). */
  alternativeCount: number;
  /** Row-major J × K coded attributes of each alternative (same column order as betas). */
  alternatives: Float64Array;
  /** Respondent weights (length N, non-negative, positive sum); default 1 each. */
  respondentWeights?: Float64Array;
  /** Group index of each respondent (length N; −1 = in no group) for per-segment shares. */
  groups?: Int32Array;
  /** G: number of groups; required with `groups`. */
  groupCount?: number;
}

const isCount = (x: number, min: number) => Number.isInteger(x) && x >= min;

/** Throws a RangeError naming the first invalid part of the input. */
export function assertShareInput(input: ShareSimulationInput): void {
  const { respondents: N, coefficients: K, alternativeCount: J } = input;
  const D = input.drawsPerRespondent ?? 1;
  if (!isCount(N, 1)) throw new RangeError('respondents must be a positive integer');
  if (!isCount(K, 1)) throw new RangeError('coefficients must be a positive integer');
  if (!isCount(D, 1)) throw new RangeError('drawsPerRespondent must be a positive integer');
  if (!isCount(J, 2)) throw new RangeError('a scenario needs at least 2 alternatives');
  if (input.betas.length !== N * D * K)
    throw new RangeError(`betas must hold respondents × draws × coefficients = ${N * D * K}`);
  if (input.alternatives.length !== J * K)
    throw new RangeError(`alternatives must hold alternatives × coefficients = ${J * K}`);
  if (!input.betas.every(Number.isFinite)) throw new RangeError('betas must be finite');
  if (!input.alternatives.every(Number.isFinite))
    throw new RangeError('alternatives must be finite');
  if (input.drawWeights) {
    if (input.drawWeights.length !== N * D)
      throw new RangeError('drawWeights must hold respondents × draws values');
    for (let n = 0; n < N; n++) {
      let sum = 0;
      for (let d = 0; d < D; d++) {
        const w = input.drawWeights[n * D + d];
        if (!(w >= 0)) throw new RangeError('drawWeights must be non-negative');
        sum += w;
      }
      if (Math.abs(sum - 1) > 1e-9)
        throw new RangeError(`drawWeights of respondent ${n} must sum to 1`);
    }
  }
  if (input.respondentWeights) {
    if (input.respondentWeights.length !== N)
      throw new RangeError('respondentWeights must hold one value per respondent');
    let sum = 0;
    for (const w of input.respondentWeights) {
      if (!(w >= 0) || !Number.isFinite(w))
        throw new RangeError('respondentWeights must be finite and non-negative');
      sum += w;
    }
    if (!(sum > 0)) throw new RangeError('respondentWeights must have a positive sum');
  }
  if (input.groups) {
    const G = input.groupCount;
    if (G === undefined || !isCount(G, 1))
      throw new RangeError('groupCount must be a positive integer when groups are given');
    if (input.groups.length !== N)
      throw new RangeError('groups must hold one index per respondent');
    for (const g of input.groups)
      if (g < -1 || g >= G) throw new RangeError(`group index ${g} is outside 0..${G - 1}`);
  } else if (input.groupCount !== undefined && input.groupCount !== 0) {
    throw new RangeError('groupCount needs groups');
  }
}
