/**
 * Writes the seeded simulated data set of the HB benchmark (scripts/bench-data/hb-choices.csv)
 * and its true parameters (hb-truth.json): 330 respondents × 16 tasks × 5 alternatives (four
 * water-service packages of the invented Larkspur Valley Water scenario and "none of these"),
 * 10 coefficients drawn per respondent from a correlated normal N(μ, Σ), logit choices with
 * Gumbel errors. Deterministic; run once (npx tsx scripts/generate-hb-bench-data.ts) and commit.
 */
import { writeFileSync } from 'node:fs';
import { drawStandardNormal } from '../server/engine/draws/gamma-variate';
import { createPrng } from '../server/engine/draws/prng';
import { choleskyDecompose } from '../server/engine/linalg/cholesky';

const N = 330;
const T = 16;
const PACKAGES = 4;
const names = [
  'none',
  'bill',
  'interruptions_2',
  'interruptions_1',
  'warnings_2',
  'warnings_0',
  'river_fair',
  'river_good',
  'renewables_10pp',
  'smart_meter',
];
const mu = [-0.8, -0.15, 0.35, 0.6, 0.3, 0.5, 0.6, 1.1, 0.12, 0.2];
const sd = [1.0, 0.08, 0.3, 0.35, 0.25, 0.3, 0.4, 0.6, 0.08, 0.3];
const correlations: [number, number, number][] = [
  [0, 1, -0.3],
  [2, 3, 0.5],
  [4, 5, 0.5],
  [6, 7, 0.6],
  [1, 8, -0.2],
  [7, 8, 0.3],
];
const K = names.length;
const sigma = new Float64Array(K * K);
for (let k = 0; k < K; k++) sigma[k * K + k] = sd[k] ** 2;
for (const [a, b, r] of correlations) sigma[a * K + b] = sigma[b * K + a] = r * sd[a] * sd[b];
const L = new Float64Array(K * K);
if (!choleskyDecompose(sigma, K, L))
  throw new Error('the true covariance is not positive definite');

const prng = createPrng(20_260_501, 0x4842);
const pick = (n: number) => prng.nextUint32() % n;
const rows: string[] = [['respondent', 'task', 'alt', 'chosen', ...names].join(',')];
for (let n = 1; n <= N; n++) {
  const z = Array.from({ length: K }, () => drawStandardNormal(prng));
  const beta = mu.map(
    (m, i) => m + z.slice(0, i + 1).reduce((s, zj, j) => s + L[i * K + j] * zj, 0),
  );
  for (let t = 1; t <= T; t++) {
    const alts: number[][] = [];
    for (let j = 0; j < PACKAGES; j++) {
      const interruptions = pick(3); // 4, 2, 1 a year
      const warnings = pick(3); // 6, 2, 0 days
      const river = pick(3); // poor, fair, good
      alts.push([
        0,
        [0, 3, 6, 10, 15][pick(5)],
        interruptions === 1 ? 1 : 0,
        interruptions === 2 ? 1 : 0,
        warnings === 1 ? 1 : 0,
        warnings === 2 ? 1 : 0,
        river === 1 ? 1 : 0,
        river === 2 ? 1 : 0,
        [2, 5, 8][pick(3)],
        pick(2),
      ]);
    }
    alts.push([1, 0, 0, 0, 0, 0, 0, 0, 0, 0]);
    const utility = alts.map(
      (x) => x.reduce((s, v, k) => s + v * beta[k], 0) - Math.log(-Math.log(prng.nextDouble())),
    );
    const chosen = utility.indexOf(Math.max(...utility));
    alts.forEach((x, j) => rows.push([n, t, j + 1, j === chosen ? 1 : 0, ...x].join(',')));
  }
}
const dir = new URL('./bench-data/', import.meta.url);
writeFileSync(new URL('hb-choices.csv', dir), `${rows.join('\n')}\n`);
writeFileSync(
  new URL('hb-truth.json', dir),
  `${JSON.stringify({ names, mu, sd, correlations, respondents: N, tasks: T, alternatives: PACKAGES + 1 }, null, 2)}\n`,
);
console.log(`wrote ${rows.length - 1} rows for ${N} respondents`);
