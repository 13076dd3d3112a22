/**
 * A seeded long-format choice file for import tests and `npm run bench:import`: an invented
 * water-service study (Larkspur Valley Water) with a 24-task random design in 2 blocks, 3
 * alternatives per task, and choices simulated from a multinomial logit with known
 * coefficients (Gumbel errors by inversion). Lines are produced one at a time, so a million
 * rows can be written to a file without holding them.
 */
import { createPrng } from '../../server/engine/draws/prng';
import { randomIndex } from '../../server/engine/draws/random-index';

export const syntheticAttributes = {
  bill: [0, 3, 6, 10, 15],
  interruptions: [4, 2, 1],
  river: ['poor', 'fair', 'good'],
  renewables: [20, 50, 80],
} as const;

/** The simulation's coefficients (river: dummy-coded against "poor"). */
export const syntheticTruth = {
  bill: -0.15,
  interruptions: -0.3,
  riverFair: 0.5,
  riverGood: 1.0,
  renewables: 0.01,
};

export const syntheticHeader = 'respondent,task,alt,chosen,bill,interruptions,river,renewables';

const TASKS = 24;
const BLOCKS = 2;
const ALTERNATIVES = 3;

type Alternative = [number, number, string, number];

function utility(a: Alternative): number {
  const t = syntheticTruth;
  const river = a[2] === 'fair' ? t.riverFair : a[2] === 'good' ? t.riverGood : 0;
  return t.bill * a[0] + t.interruptions * a[1] + river + t.renewables * a[3];
}

/** Data lines (no header) for `respondents` respondents with 12 tasks each (36 rows). */
export function* syntheticChoiceLines(respondents: number, seed = 20261203): Generator<string> {
  const random = createPrng(seed);
  const pick = <T>(xs: readonly T[]) => xs[randomIndex(random, xs.length)];
  const design: Alternative[][] = Array.from({ length: TASKS }, () =>
    Array.from({ length: ALTERNATIVES }, () => [
      pick(syntheticAttributes.bill),
      pick(syntheticAttributes.interruptions),
      pick(syntheticAttributes.river),
      pick(syntheticAttributes.renewables),
    ]),
  );
  const perBlock = TASKS / BLOCKS;
  for (let r = 1; r <= respondents; r++) {
    const block = (r - 1) % BLOCKS;
    for (let k = 0; k < perBlock; k++) {
      const task = block * perBlock + k;
      const alternatives = design[task];
      let best = 0;
      let bestU = -Infinity;
      alternatives.forEach((a, j) => {
        const u = utility(a) - Math.log(-Math.log(random.nextDouble()));
        if (u > bestU) [best, bestU] = [j, u];
      });
      for (let j = 0; j < ALTERNATIVES; j++)
        yield `R${r},${task + 1},${j + 1},${j === best ? 1 : 0},${alternatives[j].join(',')}`;
    }
  }
}

/** The whole file as text (small files: tests). */
export function syntheticChoiceCsv(respondents: number, seed?: number): string {
  return `${[syntheticHeader, ...syntheticChoiceLines(respondents, seed)].join('\n')}\n`;
}
