/**
 * Panel draws on (0, 1) for simulated maximum likelihood: every respondent gets its own R
 * points in D dimensions, used for all of that respondent's tasks (Train 2009, Discrete Choice
 * Methods with Simulation, §6.6 and ch. 9). Quasi-random types give each respondent a
 * consecutive block of the sequence after discarding the first `HALTON_SKIP` points (Train
 * 2009 §9.3.3, from memory: docs/methods.md "Draws" [M]); MLHS is the modified Latin hypercube of Hess, Train & Polak (2006,
 * Transportation Research B 40:147-163); `random` is the seeded xoshiro128** generator.
 */
import {
  createHaltonScrambles,
  HALTON_PRIMES,
  radicalInverse,
  scrambledRadicalInverse,
} from './halton';
import { createPrng } from './prng';
import { createSobolDirections, SOBOL_MAX_DIMENSIONS, sobolInteger } from './sobol';

export type DrawsType = 'halton' | 'sobol' | 'mlhs' | 'random';

export interface DrawsSpec {
  type: DrawsType;
  /** Draws per respondent (R). */
  count: number;
  /** Number of random dimensions (D). */
  dimensions: number;
  seed: number;
  /** Halton: permute digits (default true). Sobol: random digital shift (default true). */
  scrambled?: boolean;
}

/** Initial Halton/Sobol points skipped before the first respondent's block. */
export const HALTON_SKIP = 10;

/** Largest number of random dimensions each draws type supports. */
export function getMaxDrawDimensions(type: DrawsType): number {
  if (type === 'halton') return HALTON_PRIMES.length;
  if (type === 'sobol') return SOBOL_MAX_DIMENSIONS;
  return Number.MAX_SAFE_INTEGER;
}

/**
 * Fills `out` (layout [respondent][dimension][draw], length respondentCount·D·R) with the
 * uniform draws of respondents first..first+respondentCount−1. The result for a respondent
 * does not depend on how respondents are chunked, so callers can fill slices on demand.
 */
export function fillUniformDraws(
  spec: DrawsSpec,
  firstRespondent: number,
  respondentCount: number,
  out: Float64Array,
): void {
  const { count: R, dimensions: D } = spec;
  if (out.length < respondentCount * D * R) throw new RangeError('draws buffer too small');
  if (D > getMaxDrawDimensions(spec.type)) {
    throw new RangeError(
      `${spec.type} draws support at most ${getMaxDrawDimensions(spec.type)} dimensions`,
    );
  }
  const scrambled = spec.scrambled ?? true;
  if (spec.type === 'halton') {
    const scrambles = scrambled ? createHaltonScrambles(D, spec.seed) : null;
    forEachSlot(
      firstRespondent,
      respondentCount,
      D,
      R,
      (n, d, r) =>
        scrambles
          ? scrambledRadicalInverse(HALTON_SKIP + n * R + r + 1, scrambles[d])
          : radicalInverse(HALTON_SKIP + n * R + r + 1, HALTON_PRIMES[d]),
      out,
    );
  } else if (spec.type === 'sobol') {
    const dirs = createSobolDirections(D);
    const prng = createPrng(spec.seed, 0x50b0);
    const shifts = Array.from({ length: D }, () => (scrambled ? prng.nextUint32() : 0));
    forEachSlot(
      firstRespondent,
      respondentCount,
      D,
      R,
      (n, d, r) => {
        const x = (sobolInteger(HALTON_SKIP + n * R + r + 1, dirs[d]) ^ shifts[d]) >>> 0;
        return (x === 0 ? 0.5 : x) / 4294967296;
      },
      out,
    );
  } else if (spec.type === 'mlhs') {
    for (let i = 0; i < respondentCount; i++) {
      const prng = createPrng(spec.seed, firstRespondent + i);
      for (let d = 0; d < D; d++) {
        const base = (i * D + d) * R;
        const shift = prng.nextDouble();
        for (let r = 0; r < R; r++) out[base + r] = (r + shift) / R;
        for (let r = R - 1; r > 0; r--) {
          const j = Math.floor(prng.nextDouble() * (r + 1));
          const tmp = out[base + r];
          out[base + r] = out[base + j];
          out[base + j] = tmp;
        }
      }
    }
  } else {
    for (let i = 0; i < respondentCount; i++) {
      const prng = createPrng(spec.seed, firstRespondent + i);
      const base = i * D * R;
      for (let k = 0; k < D * R; k++) out[base + k] = prng.nextDouble();
    }
  }
}

function forEachSlot(
  first: number,
  count: number,
  D: number,
  R: number,
  valueAt: (respondent: number, dimension: number, draw: number) => number,
  out: Float64Array,
): void {
  for (let i = 0; i < count; i++) {
    for (let d = 0; d < D; d++) {
      const base = (i * D + d) * R;
      for (let r = 0; r < R; r++) out[base + r] = valueAt(first + i, d, r);
    }
  }
}
