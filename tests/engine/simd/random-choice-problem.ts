/**
 * Test helper: random panel choice problems for property tests of the kernels: respondents
 * with different numbers of tasks, tasks with 2–5 alternatives, attributes that are often
 * exactly zero (dummy-coded levels), every distribution, optional correlation.
 */
import { createPrng } from '../../../server/engine/draws/prng';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import type { LongChoiceRow } from '../../../server/engine/estimation/choice-data';
import {
  DISTRIBUTIONS,
  createMixedLogitLayout,
  type CoefficientDistribution,
} from '../../../server/engine/estimation/mixed-logit-layout';

export interface RandomProblemSize {
  respondents: number;
  maxTasks: number;
  K: number;
  draws: number;
}

export function createRandomChoiceProblem(seed: number, size: RandomProblemSize) {
  const prng = createPrng(seed, 0xc401ce);
  const u = () => prng.nextDouble();
  const int = (lo: number, hi: number) => lo + Math.floor(u() * (hi - lo + 1));
  const { K } = size;
  // One extra column the model does not use, so column indexes are exercised.
  const columns = [...Array.from({ length: K }, (_, k) => `x${k + 1}`), 'unused'];
  const rows: LongChoiceRow[] = [];
  for (let n = 0; n < size.respondents; n++) {
    const T = int(1, size.maxTasks);
    for (let t = 0; t < T; t++) {
      const J = int(2, 5);
      const chosen = int(0, J - 1);
      for (let j = 0; j < J; j++) {
        const values = columns.map((_, k) =>
          k % 3 === 2 ? (u() < 0.5 ? 0 : 1) : u() < 0.15 ? 0 : 2 * u() - 1,
        );
        rows.push({ respondent: n, task: t, alt: j, chosen: j === chosen ? 1 : 0, values });
      }
    }
  }
  const { data } = buildChoiceData(columns, rows);
  const distributions: CoefficientDistribution[] = Array.from(
    { length: K },
    () => DISTRIBUTIONS[int(0, DISTRIBUTIONS.length - 1)],
  );
  if (!distributions.some((d) => d !== 'fixed')) distributions[0] = 'normal';
  const normals = distributions.filter((d) => d === 'normal').length;
  const correlated = normals >= 2 && u() < 0.6;
  const layout = createMixedLogitLayout(
    data,
    distributions.map((distribution, k) => ({ name: `x${k + 1}`, distribution })),
    correlated,
  );
  const theta = Float64Array.from({ length: layout.P }, (_, p) =>
    p < K ? 1.2 * (2 * u() - 1) : 0.2 + 0.8 * u(),
  );
  const drawTypes = ['halton', 'sobol', 'mlhs', 'random'] as const;
  const draws = { type: drawTypes[int(0, 3)], count: size.draws, seed: int(1, 1000) };
  return { data, layout, theta, draws };
}
