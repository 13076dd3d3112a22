/**
 * Coefficient draws behind share intervals, made once per run and reused for every scenario
 * (so that editing a scenario only re-evaluates logit probabilities). Two kinds:
 *
 * - parameter draws (Krinsky & Robb 1986, Review of Economics and Statistics 68:715–719):
 *   θ_r = θ̂ + L z_r with L the lower Cholesky factor of the estimates' covariance and z_r
 *   standard normal — the asymptotic normal distribution of the estimator. Used for runs with
 *   one set of coefficients for everybody (MNL).
 * - conditional draws (Train 2009, *Discrete Choice Methods with Simulation*, 2nd ed., §11.6):
 *   for each respondent, draws from the distribution of their coefficients conditional on
 *   their choices instead of its mean alone. The run keeps each respondent's conditional mean
 *   and SD per coefficient (not the weighted population draws), so the conditional
 *   distribution is approximated by independent normals with those moments — lognormals with
 *   the same mean and SD for lognormal coefficients, so their sign never flips. For latent
 *   class runs the conditional distribution is exact: class c with the respondent's posterior
 *   probability h_nc (Greene & Hensher 2003, §4).
 *
 * Standard normals are Φ⁻¹ of a seeded xoshiro128** stream (shared/engine/random), so the
 * browser and the server produce the same draws for the same seed.
 */
import { createPrng } from '../random/prng';
import { drawMultivariateNormal } from '../random/multivariate-normal';
import { inverseNormal } from '../random/inverse-normal';

export type ShareDrawKind = 'parameter' | 'conditional';

export interface ShareDraws {
  kind: ShareDrawKind;
  /** N: respondents (1 for parameter draws). */
  respondents: number;
  /** R: draws per respondent. */
  draws: number;
  /** K: coefficients. */
  coefficients: number;
  /** Row-major N × R × K coefficient vectors. */
  betas: Float64Array;
}

const assertCount = (x: number, name: string) => {
  if (!(Number.isInteger(x) && x >= 1)) throw new RangeError(`${name} must be a positive integer`);
};

/**
 * Krinsky–Robb draws θ_r = θ̂ + L z_r. `choleskyLower` is the row-major K × K lower factor
 * of the covariance (entries above the diagonal are ignored).
 */
export function drawParameterVectors(
  estimates: Float64Array,
  choleskyLower: Float64Array,
  draws: number,
  seed: number,
): ShareDraws {
  const K = estimates.length;
  assertCount(K, 'coefficients');
  assertCount(draws, 'draws');
  if (choleskyLower.length !== K * K) throw new RangeError('the Cholesky factor must be K × K');
  if (!estimates.every(Number.isFinite) || !choleskyLower.every(Number.isFinite))
    throw new RangeError('estimates and covariance must be finite');
  const prng = createPrng(seed, 0x6b72);
  const z = new Float64Array(K);
  const betas = new Float64Array(draws * K);
  for (let r = 0; r < draws; r++) {
    drawMultivariateNormal(estimates, choleskyLower, K, prng, z, betas, r * K);
  }
  return { kind: 'parameter', respondents: 1, draws, coefficients: K, betas };
}

export interface ConditionalMoments {
  respondents: number;
  coefficients: number;
  /** Row-major N × K conditional means. */
  means: Float64Array;
  /** Row-major N × K conditional SDs (0 for fixed coefficients). */
  sds: Float64Array;
  /** Length K: 1 where the coefficient is lognormal (of either sign). */
  lognormal: Uint8Array;
}

/** Conditional draws from each respondent's moments (see the file comment). */
export function drawConditionalVectors(
  m: ConditionalMoments,
  draws: number,
  seed: number,
): ShareDraws {
  const { respondents: N, coefficients: K } = m;
  assertCount(N, 'respondents');
  assertCount(K, 'coefficients');
  assertCount(draws, 'draws');
  if (m.means.length !== N * K || m.sds.length !== N * K)
    throw new RangeError('means and sds must hold respondents × coefficients values');
  if (m.lognormal.length !== K)
    throw new RangeError('lognormal must hold one flag per coefficient');
  if (!m.means.every(Number.isFinite) || !m.sds.every((s) => s >= 0 && Number.isFinite(s)))
    throw new RangeError('means must be finite and sds finite and non-negative');
  const prng = createPrng(seed, 0x636f);
  const betas = new Float64Array(N * draws * K);
  for (let n = 0; n < N; n++)
    for (let r = 0; r < draws; r++) {
      const o = (n * draws + r) * K;
      for (let k = 0; k < K; k++) {
        const mean = m.means[n * K + k];
        const sd = m.sds[n * K + k];
        const z = inverseNormal(prng.nextDouble());
        if (m.lognormal[k] === 1 && mean !== 0) {
          // Lognormal with this mean and SD: σ² = ln(1 + sd²/mean²), μ = ln|mean| − σ²/2.
          const s2 = Math.log1p((sd * sd) / (mean * mean));
          const mu = Math.log(Math.abs(mean)) - s2 / 2;
          betas[o + k] = Math.sign(mean) * Math.exp(mu + Math.sqrt(s2) * z);
        } else betas[o + k] = mean + sd * z;
      }
    }
  return { kind: 'conditional', respondents: N, draws, coefficients: K, betas };
}

/**
 * Latent class: each draw of respondent n is one class's coefficients, class c chosen with
 * probability h_nc. `classBetas` is C × K, `probabilities` N × C (rows sum to 1).
 */
export function drawClassVectors(
  classBetas: Float64Array,
  probabilities: Float64Array,
  respondents: number,
  classes: number,
  draws: number,
  seed: number,
): ShareDraws {
  assertCount(respondents, 'respondents');
  assertCount(classes, 'classes');
  assertCount(draws, 'draws');
  const K = classBetas.length / classes;
  assertCount(K, 'coefficients');
  if (probabilities.length !== respondents * classes)
    throw new RangeError('probabilities must hold respondents × classes values');
  const prng = createPrng(seed, 0x6c63);
  const betas = new Float64Array(respondents * draws * K);
  for (let n = 0; n < respondents; n++)
    for (let r = 0; r < draws; r++) {
      const u = prng.nextDouble();
      let c = 0;
      let cumulative = probabilities[n * classes];
      while (u > cumulative && c < classes - 1) cumulative += probabilities[n * classes + ++c];
      betas.set(classBetas.subarray(c * K, (c + 1) * K), (n * draws + r) * K);
    }
  return { kind: 'conditional', respondents, draws, coefficients: K, betas };
}
