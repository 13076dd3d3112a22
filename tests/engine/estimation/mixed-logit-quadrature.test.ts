import { describe, expect, it } from 'vitest';
import { createPrng } from '../../../server/engine/draws/prng';
import { inverseNormal } from '../../../server/engine/draws/inverse-normal';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import type { ChoiceData, LongChoiceRow } from '../../../server/engine/estimation/choice-data';
import { createMixedLogitKernel } from '../../../server/engine/estimation/mixed-logit-kernel';
import { createMixedLogitLayout } from '../../../server/engine/estimation/mixed-logit-layout';
import { createStandardVariates } from '../../../server/engine/estimation/standard-variates';
import { computeTasteProfiles } from '../../../server/engine/estimation/taste-profiles';
import { computeGaussHermite } from '../../../server/engine/linalg/gauss-hermite';

/**
 * One normal random coefficient β ~ N(μ, σ²) and binary tasks: the simulated panel probability
 * P_n = (1/R) Σ_r Π_t P_nt(β_r) and the conditional mean E[β | y_n] (Revelt & Train 2000) are
 * compared with Gauss-Hermite quadrature, E f(Z) ≈ Σ w_i/√π f(μ + √2σx_i) (docs/methods.md "Estimation check values").
 * Tolerance: Koksma-Hlawka, |error| ≤ V(g)·D*_R, with V(g) ≤ T for a product of T monotone
 * probabilities in (0, 1) and the discrepancy of R consecutive van der Corput points
 * D*_R ≤ (log₂R + 2)/R (Niederreiter 1992, Random Number Generation and Quasi-Monte Carlo
 * Methods, §3.1; constant from memory). For the conditional mean the integrand β·g has
 * variation ≤ (T + 1)·max|β_r|, and the ratio adds a factor 1/P_n.
 */
const MU = 0.5;
const SIGMA = 1.2;
const GH = computeGaussHermite(120);

function makePanel(): ChoiceData {
  const prng = createPrng(5);
  const rows: LongChoiceRow[] = [];
  for (let n = 0; n < 6; n++) {
    for (let t = 0; t < 4; t++) {
      const x = 2 * prng.nextDouble() - 1;
      const firstChosen = prng.nextDouble() < 0.6 ? 1 : 0;
      rows.push({ respondent: n, task: t, alt: 1, chosen: firstChosen, values: [x] });
      rows.push({ respondent: n, task: t, alt: 2, chosen: 1 - firstChosen, values: [0] });
    }
  }
  return buildChoiceData(['x'], rows).data;
}

/** Panel probability and conditional mean of respondent n by Gauss-Hermite quadrature. */
function integrateByQuadrature(
  data: ChoiceData,
  n: number,
  mu: number,
  sigma: number,
): { P: number; E: number } {
  let P = 0;
  let M = 0;
  GH.nodes.forEach((node, i) => {
    const beta = mu + Math.SQRT2 * sigma * node;
    let prob = 1;
    for (let t = data.taskStart[n]; t < data.taskStart[n + 1]; t++)
      prob /= 1 + Math.exp(beta * data.diffs[data.diffStart[t]]);
    const w = GH.weights[i] / Math.sqrt(Math.PI);
    P += w * prob;
    M += w * prob * beta;
  });
  return { P, E: M / P };
}

function simulate(data: ChoiceData, mu: number, sigma: number, R: number) {
  const layout = createMixedLogitLayout(data, [{ name: 'x', distribution: 'normal' }], false);
  const N = data.taskStart.length - 1;
  const theta = Float64Array.from([mu, sigma]);
  const variates = createStandardVariates(
    layout,
    { type: 'halton', count: R, seed: 1, scrambled: false },
    0,
    N,
  );
  const kernel = createMixedLogitKernel(data, layout, variates, R, 0, N);
  const betas = new Float64Array(R);
  const w = new Float64Array(R);
  const P = Array.from({ length: N }, (_, n) =>
    Math.exp(kernel.simulateRespondent(n, theta, betas, w)),
  );
  const E = computeTasteProfiles(data, layout, theta, { count: R, scrambled: false }).profiles.map(
    (p) => p.mean.x,
  );
  return { P, E };
}

const bound = (R: number, T: number) => (T * (Math.log2(R) + 2)) / R;

describe('simulated panel probability and conditional means vs Gauss-Hermite quadrature', () => {
  const data = makePanel();
  const exact = Array.from({ length: 6 }, (_, n) => integrateByQuadrature(data, n, MU, SIGMA));

  it.each([1000, 100000])('with R = %i plain Halton draws, within the Koksma-Hlawka bound', (R) => {
    const sim = simulate(data, MU, SIGMA, R);
    const T = 4;
    const betaMax = Math.abs(MU) + SIGMA * Math.abs(inverseNormal(1 / (2 * R)));
    exact.forEach(({ P, E }, n) => {
      expect(Math.abs(sim.P[n] - P)).toBeLessThan(bound(R, T));
      expect(Math.abs(sim.E[n] - E)).toBeLessThan(((T + 1) * betaMax * bound(R, T)) / P);
    });
  });

  it('the error shrinks as draws grow (100 → 100000)', () => {
    const err = (R: number) => {
      const sim = simulate(data, MU, SIGMA, R);
      return Math.max(...exact.map(({ E }, n) => Math.abs(sim.E[n] - E)));
    };
    expect(err(100000)).toBeLessThan(err(100) / 50);
  });
});

describe('docs/methods.md "Estimation check values" conditional-mean checks', () => {
  const oneTask = buildChoiceData(
    ['x'],
    [
      { respondent: 1, task: 1, alt: 1, chosen: 1, values: [1] },
      { respondent: 1, task: 1, alt: 2, chosen: 0, values: [0] },
    ],
  ).data;
  const twoTasks = buildChoiceData(
    ['x'],
    [
      { respondent: 1, task: 1, alt: 1, chosen: 1, values: [1] },
      { respondent: 1, task: 1, alt: 2, chosen: 0, values: [0] },
      { respondent: 1, task: 2, alt: 1, chosen: 1, values: [1] },
      { respondent: 1, task: 2, alt: 2, chosen: 0, values: [0] },
    ],
  ).data;

  /**
   * One respondent, β ~ N(mu, 1) over `T` tasks: quadrature gives the published P and E[β|y],
   * and R plain Halton draws come within the Koksma-Hlawka bound of both (as above).
   */
  const checkPublished = (data: ChoiceData, T: number, mu: number, P: number, E: number) => {
    const gh = integrateByQuadrature(data, 0, mu, 1);
    expect(gh.P).toBeCloseTo(P, 12);
    expect(gh.E).toBeCloseTo(E, 10);
    const R = 100000;
    const sim = simulate(data, mu, 1, R);
    expect(Math.abs(sim.P[0] - P)).toBeLessThan(bound(R, T));
    const betaMax = Math.abs(mu) + Math.abs(inverseNormal(1 / (2 * R)));
    expect(Math.abs(sim.E[0] - E)).toBeLessThan(((T + 1) * betaMax * bound(R, T)) / P);
  };

  it('Check G [C]: β ~ N(0,1), one task: P = 0.5, E[β|y] = 0.413241928283814', () => {
    checkPublished(oneTask, 1, 0, 0.5, 0.413241928283814);
  });

  it('Check H [C]: β ~ N(0.5,1), two tasks: P = 0.403040699225125, E[β|y] = 1.06787021052228', () => {
    checkPublished(twoTasks, 2, 0.5, 0.403040699225125, 1.06787021052228);
  });
});
