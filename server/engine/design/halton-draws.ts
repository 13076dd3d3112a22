/**
 * Halton quasi-random points with Braaten–Weller-style random digit permutations
 * ("scrambled Halton"; Halton 1960; Bhat 2003, Transportation Research B 37:837-855 [M]),
 * used to average the D-error over prior draws (Sándor & Wedel 2001; Bliemer, Rose & Hess
 * 2008 show quasi-random draws beat pseudo-random ones at the same count [M]).
 * Dimension d uses the d-th prime as base; digit 0 is never permuted so points stay in (0, 1).
 * With base 2 the permutation is the identity, so dimension 0 is the plain van der Corput
 * sequence. The first `skip` indices are discarded (Train 2009 §9.3.3 advises dropping the
 * first ~10 [M]).
 */
import { createSeededRandom } from './seeded-random';

const PRIMES = [
  2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37, 41, 43, 47, 53, 59, 61, 67, 71, 73, 79, 83, 89, 97,
  101, 103, 107, 109, 113, 127, 131, 137, 139, 149, 151, 157, 163, 167, 173, 179, 181, 191, 193,
  197, 199, 211, 223, 227, 229, 233, 239, 241, 251, 257, 263, 269, 271, 277, 281, 283, 293,
];

/** Largest supported dimension of the Halton points. */
export const MAX_HALTON_DIMENSION = PRIMES.length;

/** Radical inverse of index i in `base`, with digit permutation `perm` (perm[0] = 0). */
function getScrambledRadicalInverse(i: number, base: number, perm: Int32Array): number {
  let value = 0;
  let factor = 1 / base;
  let n = i;
  while (n > 0) {
    const digit = n % base;
    value += perm[digit] * factor;
    n = (n - digit) / base;
    factor /= base;
  }
  return value;
}

/**
 * Writes `count` points of dimension `dimension` into `out` (row-major count × dimension),
 * using indices skip+1 .. skip+count. Scrambling is seeded, so results are reproducible.
 */
export function fillScrambledHalton(
  count: number,
  dimension: number,
  out: Float64Array,
  options: { skip?: number; seed?: number } = {},
): void {
  if (dimension > MAX_HALTON_DIMENSION)
    throw new RangeError(`Halton points support at most ${MAX_HALTON_DIMENSION} dimensions`);
  if (out.length < count * dimension) throw new RangeError('Output buffer too small');
  const skip = options.skip ?? 10;
  const random = createSeededRandom(options.seed ?? 1);
  for (let d = 0; d < dimension; d++) {
    const base = PRIMES[d];
    const perm = new Int32Array(base);
    for (let k = 0; k < base; k++) perm[k] = k;
    for (let k = base - 1; k > 1; k--) {
      const m = 1 + random.nextInt(k);
      const t = perm[k];
      perm[k] = perm[m];
      perm[m] = t;
    }
    for (let r = 0; r < count; r++) {
      out[r * dimension + d] = getScrambledRadicalInverse(skip + r + 1, base, perm);
    }
  }
}
