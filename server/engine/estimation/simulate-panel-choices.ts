/**
 * Synthetic panel choice data from a known random-coefficient logit, for recovery tests and
 * benchmarks: each respondent draws β_n once from the stated distributions and answers every
 * task by the logit rule (Gumbel errors by inverse CDF, Train 2009 §3.1). Attributes are
 * independent N(0, 1) unless `levels` are given. Seeded and deterministic.
 */
import { inverseNormal } from '../draws/inverse-normal';
import { createPrng } from '../draws/prng';
import type { LongChoiceRow } from './choice-data';
import type { CoefficientDistribution } from './mixed-logit-layout';

export interface TrueCoefficient {
  name: string;
  distribution: CoefficientDistribution;
  /** Location b (for lognormals: mean of ln |β|). */
  location: number;
  /** Spread s (SD for normal and lognormal, half-width for triangular and uniform). */
  spread?: number;
  /** Optional discrete attribute levels to sample from instead of N(0, 1). */
  levels?: number[];
}

export interface SimulatePanelChoicesParams {
  respondents: number;
  tasks: number;
  alternatives: number;
  coefficients: TrueCoefficient[];
  seed: number;
}

export interface SimulatedPanel {
  columns: string[];
  rows: LongChoiceRow[];
  /** N × K true individual coefficients. */
  trueBetas: Float64Array;
}

/** Draws one individual coefficient from its distribution given a standard normal z and uniform u. */
function drawBeta(c: TrueCoefficient, z: number, u: number): number {
  const s = c.spread ?? 0;
  switch (c.distribution) {
    case 'fixed':
      return c.location;
    case 'normal':
      return c.location + s * z;
    case 'lognormal':
      return Math.exp(c.location + s * z);
    case 'neg_lognormal':
      return -Math.exp(c.location + s * z);
    case 'triangular':
      return c.location + s * (u < 0.5 ? Math.sqrt(2 * u) - 1 : 1 - Math.sqrt(2 * (1 - u)));
    case 'uniform':
      return c.location + s * (2 * u - 1);
  }
}

/** Simulates long-format rows (respondent, task, alt, chosen, values). */
export function simulatePanelChoices(params: SimulatePanelChoicesParams): SimulatedPanel {
  const { respondents: N, tasks: T, alternatives: J, coefficients, seed } = params;
  const K = coefficients.length;
  const prng = createPrng(seed, 0x51);
  const rows: LongChoiceRow[] = [];
  const trueBetas = new Float64Array(N * K);
  const x = new Float64Array(J * K);
  const utility = new Float64Array(J);
  for (let n = 0; n < N; n++) {
    for (let k = 0; k < K; k++) {
      const u = prng.nextDouble();
      trueBetas[n * K + k] = drawBeta(coefficients[k], inverseNormal(u), u);
    }
    for (let t = 0; t < T; t++) {
      let best = 0;
      for (let j = 0; j < J; j++) {
        let v = 0;
        for (let k = 0; k < K; k++) {
          const levels = coefficients[k].levels;
          const value = levels
            ? levels[prng.nextUint32() % levels.length]
            : inverseNormal(prng.nextDouble());
          x[j * K + k] = value;
          v += value * trueBetas[n * K + k];
        }
        utility[j] = v - Math.log(-Math.log(prng.nextDouble()));
        if (utility[j] > utility[best]) best = j;
      }
      for (let j = 0; j < J; j++) {
        rows.push({
          respondent: n + 1,
          task: t + 1,
          alt: j + 1,
          chosen: j === best ? 1 : 0,
          values: Array.from(x.subarray(j * K, (j + 1) * K)),
        });
      }
    }
  }
  return { columns: coefficients.map((c) => c.name), rows, trueBetas };
}
