/**
 * Simulated two-class panel data for the latent class checks: class membership depends on one
 * binary background answer through a logit (π₂ = Λ(γ₀ + γ₁x)), each class answers by its own MNL
 * with standard Gumbel errors (Train 2009, ch. 3). Seeded and deterministic.
 */
import { drawStandardNormal } from '../../../server/engine/draws/gamma-variate';
import { createPrng } from '../../../server/engine/draws/prng';
import type { LongChoiceRow } from '../../../server/engine/estimation/choice-data';

export const TWO_CLASS_TRUTH = {
  names: ['river', 'outages', 'bill'],
  betas: [
    [1.2, -0.2, -0.15],
    [0.2, -0.9, -0.45],
  ],
  gamma: [-0.9, 1.3],
};

export function simulateTwoClasses(N: number, T: number, seed: number) {
  const prng = createPrng(seed, 0x2c1a);
  const rows: LongChoiceRow[] = [];
  const covariate = new Float64Array(N);
  const classOf = new Int32Array(N);
  for (let n = 0; n < N; n++) {
    const x = prng.nextDouble() < 0.5 ? 1 : 0;
    covariate[n] = x;
    const p2 = 1 / (1 + Math.exp(-(TWO_CLASS_TRUTH.gamma[0] + TWO_CLASS_TRUTH.gamma[1] * x)));
    const c = prng.nextDouble() < p2 ? 1 : 0;
    classOf[n] = c;
    const beta = TWO_CLASS_TRUTH.betas[c];
    for (let t = 0; t < T; t++) {
      const alts = [0, 1, 2].map(() => [
        drawStandardNormal(prng),
        drawStandardNormal(prng),
        [0, 2, 4, 6][prng.nextUint32() % 4],
      ]);
      const u = alts.map(
        (a) => a.reduce((s, v, k) => s + v * beta[k], 0) - Math.log(-Math.log(prng.nextDouble())),
      );
      const chosen = u.indexOf(Math.max(...u));
      alts.forEach((values, j) =>
        rows.push({
          respondent: n + 1,
          task: t + 1,
          alt: j + 1,
          chosen: j === chosen ? 1 : 0,
          values,
        }),
      );
    }
  }
  return { rows, covariate, classOf };
}
