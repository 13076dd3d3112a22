/**
 * The HB sampler's respondent layer (individual-step.ts): per-respondent column-major design
 * blocks, utilities updated by accepted increments, and the current log-likelihood kept.
 * - It is the same Markov chain as the previous layer, which recomputed every proposal's
 *   log-likelihood from the row-major data (kept for the benchmark in
 *   scripts/lib/hb-reference-individual-step.ts): same seed, same draw stream, so the two chains
 *   agree draw for draw up to rounding (1e-9; both accumulate the same sums in another order).
 * - The WebAssembly SIMD kernel gives the TypeScript kernel's chain bit for bit, whether it runs
 *   whole MH sweeps (respondent-simd-kernel.ts: proposal, likelihood, fdlibm's logarithm and the
 *   acceptance in the kernel, drawing from the chain generator's stream) or only the proposals'
 *   likelihoods: same sums in the same order, the same exponential (Tang 1989, both kernels), the
 *   logarithm and exponential of Math or their fdlibm ports (hb-fdlibm.test.ts). Exact equality,
 *   no tolerance: a speed-up must not change a seeded run.
 * - The kept log-likelihood equals ln P(y_n | β_n) recomputed from scratch (Train 2009, eq. 3.6)
 *   after many accepted moves: the increments' rounding drift stays at the 1e-12 level.
 */
import { describe, expect, it } from 'vitest';
import { createReferenceIndividualStep } from '../../../scripts/lib/hb-reference-individual-step';
import { createPrng } from '../../../server/engine/draws/prng';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import { simulatePanelChoices } from '../../../server/engine/estimation/simulate-panel-choices';
import { checkHbOptions } from '../../../server/engine/hb/check-hb-options';
import { getHbStart } from '../../../server/engine/hb/hb-start';
import {
  createIndividualStep,
  toBeta,
  type IndividualStepFactory,
} from '../../../server/engine/hb/individual-step';
import {
  computeRespondentLoglik,
  getMaxRespondentRows,
} from '../../../server/engine/hb/respondent-logit-loglik';
import { runHbChain } from '../../../server/engine/hb/run-hb-chain';

const sim = simulatePanelChoices({
  respondents: 60,
  tasks: 7,
  alternatives: 3,
  seed: 21,
  coefficients: [
    { name: 'river', distribution: 'normal', location: 0.7, spread: 0.5 },
    { name: 'outages', distribution: 'normal', location: -0.4, spread: 0.3 },
    { name: 'renewables', distribution: 'normal', location: 0.3, spread: 0.2 },
    { name: 'bill', distribution: 'neg_lognormal', location: -1, spread: 0.3, levels: [0, 1, 3] },
  ],
});
// One more task per respondent: task 1 with its non-chosen alternatives shown twice (4 rows), and
// for odd-numbered respondents task 2 once more: 18 or 20 rows, so the kernel's passes of 8 and 4
// rows and its single rows all run.
const first = sim.rows.filter((r) => r.task === 1);
const second = sim.rows.filter((r) => r.task === 2 && Number(r.respondent) % 2 === 1);
const rows = sim.rows.concat(
  first.map((r) => ({ ...r, task: 'extra' })),
  first.filter((r) => r.chosen === 0).map((r) => ({ ...r, task: 'extra', alt: `${r.alt}x` })),
  second.map((r) => ({ ...r, task: 'again' })),
);
const { data } = buildChoiceData(sim.columns, rows);
const options = {
  coefficients: [
    { name: 'river', distribution: 'normal' },
    { name: 'outages', distribution: 'normal' },
    { name: 'renewables', distribution: 'fixed' },
    { name: 'bill', distribution: 'neg_lognormal' },
  ],
  correlated: true,
  iterations: 400,
  burnin: 200,
  thin: 2,
  // The previous layer (the reference) takes one step per respondent per iteration.
  steps: 1,
  chains: 1,
  seed: 5,
};

describe('HB respondent layer', () => {
  it('gives the same chain as the previous layer, draw for draw (same seed stream)', async () => {
    const opts = checkHbOptions(data, options);
    const start = await getHbStart(data, opts.layout, 0, opts.seed);
    const current = runHbChain(data, opts, 0, start);
    const previous = runHbChain(data, opts, 0, start, {}, createReferenceIndividualStep);
    expect(current.acceptance).toBe(previous.acceptance);
    expect(current.acceptanceFixed).toBe(previous.acceptanceFixed);
    expect(current.acceptanceFixed).toBeGreaterThan(0);
    for (const key of ['mu', 'sigma', 'fixed', 'loglik'] as const)
      current[key].forEach((x, i) => expect(x).toBeCloseTo(previous[key][i], 9));
    current.betas.forEach((x, i) => expect(x).toBe(previous.betas[i]));
  });

  it.each([1, 3])(
    'gives the TypeScript kernel’s chain bit for bit on the WebAssembly SIMD kernel, whole sweeps or likelihoods only (%i MH steps)',
    async (steps) => {
      const opts = checkHbOptions(data, { ...options, steps });
      const start = await getHbStart(data, opts.layout, 0, opts.seed);
      const kinds: string[] = [];
      const withKernel =
        (preference: 'auto' | 'likelihood' | 'typescript'): IndividualStepFactory =>
        (d, layout, alpha) => {
          const step = createIndividualStep(d, layout, alpha, preference);
          kinds.push(step.kernel ?? '');
          return step;
        };
      const sweep = runHbChain(data, opts, 0, start, {}, withKernel('auto'));
      const likelihood = runHbChain(data, opts, 0, start, {}, withKernel('likelihood'));
      const ts = runHbChain(data, opts, 0, start, {}, withKernel('typescript'));
      expect(kinds).toEqual(['simd', 'simd-likelihood', 'typescript']);
      for (const simd of [sweep, likelihood]) {
        expect(simd.acceptance).toBe(ts.acceptance);
        expect(simd.acceptanceFixed).toBe(ts.acceptanceFixed);
        for (const key of ['mu', 'sigma', 'fixed', 'loglik', 'betas'] as const)
          expect(Array.from(simd[key])).toEqual(Array.from(ts[key]));
      }
    },
  );

  it('keeps each respondent’s log-likelihood equal to the one recomputed from scratch', async () => {
    const opts = checkHbOptions(data, options);
    const { layout } = opts;
    const start = await getHbStart(data, layout, 0, opts.seed);
    const step = createIndividualStep(data, layout, start.alpha);
    const Kr = layout.random.length;
    const mu = Float64Array.from(layout.random, (k) => start.alpha[k]);
    const L = new Float64Array(Kr * Kr);
    for (let r = 0; r < Kr; r++) L[r * Kr + r] = 0.8;
    const prng = createPrng(9, 1);
    let moves = 0;
    for (let it = 0; it < 300; it++) moves += step.step(mu, L, 0.3, prng);
    const candidate = Float64Array.from(step.fixedAlpha, (f) => f + 0.01);
    step.proposeFixed(candidate);
    step.acceptFixed();
    expect(moves).toBeGreaterThan(1000);

    const N = data.taskStart.length - 1;
    const beta = new Float64Array(layout.K);
    const work = new Float64Array(getMaxRespondentRows(data));
    layout.fixed.forEach((k, f) => (beta[k] = step.fixedAlpha[f]));
    let total = 0;
    for (let n = 0; n < N; n++) {
      layout.random.forEach(
        (k, r) => (beta[k] = toBeta(layout.transform[k], step.alpha[n * Kr + r])),
      );
      total += computeRespondentLoglik(
        data.diffs,
        data.diffStart,
        data.taskStart,
        n,
        layout.K,
        beta,
        0,
        work,
      );
    }
    expect(Math.abs(step.totalLoglik() - total)).toBeLessThan(1e-9);
  });
});
