/**
 * The timed part of `npm run bench:shares`, run both in Node and, bundled, in Chromium: the
 * shared share engine (shared/engine/shares) on a synthetic run of N respondents with the
 * Larkspur attributes (K = 7 coefficients, 2 packages + the status quo), conditional
 * intervals from 200 draws per respondent, and a Krinsky–Robb model for comparison.
 * Synthetic tastes come from a seeded generator, so every run times the same numbers.
 */
import { createPrng } from '../../shared/engine/random/prng';
import { inverseNormal } from '../../shared/engine/random/inverse-normal';
import { makeDemoDefinition } from './study-factory/definition';
import type { ShareModel } from '../../shared/schemas/shares';
import { computeScenarioShares, prepareShareModel } from '../../shared/engine/shares/share-model';
import { sweepDemandCurve } from '../../shared/engine/shares/demand-curve';

/** The demo study's attributes, as a new installation has them. */
const definition = makeDemoDefinition();

/** Coded columns of the demo definition; the synthetic means are the demo design's priors. */
const keys = [
  'attr:bill',
  'attr:interruptions',
  'attr:warnings',
  'attr:river:river-fair',
  'attr:river:river-good',
  'attr:renewable',
  'asc:fixed',
];
const means = [-0.12, -0.2, -0.1, 0.5, 0.9, 0.01, 0.3];
const spreads = [0.05, 0.1, 0.05, 0.4, 0.6, 0.01, 0.5];

export function makeSyntheticModel(respondents: number): ShareModel {
  const K = keys.length;
  const prng = createPrng(20261203);
  const betas: number[] = [];
  const sds: number[] = [];
  for (let n = 0; n < respondents; n++)
    for (let k = 0; k < K; k++) {
      const z = inverseNormal(prng.nextDouble());
      betas.push(k === 0 ? -Math.exp(Math.log(0.12) + 0.4 * z) : means[k] + spreads[k] * z);
      sds.push(spreads[k] / 2);
    }
  return {
    runId: 'bench',
    model: 'mixed',
    method: 'conditional_means',
    definition,
    coefficients: keys.map((key, k) => ({ name: key, key, lognormal: k === 0 })),
    respondents,
    vectors: 1,
    betas,
    weights: null,
    sds,
    choleskyLower: null,
    interval: 'conditional',
    intervalNote: null,
    seed: 7,
    sampleRespondents: respondents,
  };
}

const scenario = {
  includeFixed: true,
  alternatives: [
    {
      name: 'A',
      alternative: 0,
      levels: {
        bill: 'bill-6',
        interruptions: 'interruptions-2',
        warnings: 'warnings-2',
        river: 'river-good',
        renewable: 'renewable-50',
      },
    },
    {
      name: 'B',
      alternative: 0,
      levels: {
        bill: 'bill-3',
        interruptions: 'interruptions-4',
        warnings: 'warnings-0',
        river: 'river-fair',
        renewable: 'renewable-80',
      },
    },
  ],
};

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
};

function time(repeats: number, fn: () => unknown): number {
  fn(); // warm-up: compile the kernels
  const ms: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const t0 = performance.now();
    fn();
    ms.push(performance.now() - t0);
  }
  return Number(median(ms).toFixed(2));
}

export type ShareBenchFigures = {
  respondents: number;
  conditionalDraws: number;
  /** Median ms: making the interval draws once per run. */
  prepareMs: number;
  /** Median ms: one scenario, point shares only (N × J logit probabilities). */
  pointMs: number;
  /** Median ms: one scenario with point shares and the conditional interval. */
  recomputeMs: number;
  /** Median ms: an 11-point demand curve with intervals. */
  sweepMs: number;
  /** Median ms: one scenario of an MNL run with a 1,000-draw Krinsky–Robb interval. */
  krinskyRobbMs: number;
};

export function runShareBench(respondents = 1000, repeats = 15): ShareBenchFigures {
  const model = makeSyntheticModel(respondents);
  const prepared = prepareShareModel(model);
  const pointOnly = prepareShareModel({ ...model, interval: null });
  const K = keys.length;
  const mnl = prepareShareModel({
    ...model,
    model: 'mnl',
    method: 'point_estimates',
    respondents: 1,
    betas: means,
    sds: null,
    interval: 'parameter',
    choleskyLower: Array.from({ length: K * K }, (_, i) =>
      i % (K + 1) === 0 ? spreads[i / (K + 1)] / 10 : 0,
    ),
  });
  return {
    respondents,
    conditionalDraws: prepared.draws!.draws,
    prepareMs: time(Math.max(3, repeats / 5), () => prepareShareModel(model)),
    pointMs: time(repeats, () => computeScenarioShares(pointOnly, scenario)),
    recomputeMs: time(repeats, () => computeScenarioShares(prepared, scenario)),
    sweepMs: time(Math.max(3, repeats / 3), () =>
      sweepDemandCurve(prepared, scenario, { alternative: 0, attributeId: 'bill', points: 11 }),
    ),
    krinskyRobbMs: time(repeats, () => computeScenarioShares(mnl, scenario)),
  };
}
