/**
 * Halton sequences (J. H. Halton, "On the efficiency of certain quasi-random sequences of
 * points in evaluating multi-dimensional integrals", Numer. Math. 2:84-90, 1960): dimension d
 * uses the radical inverse of the point index in the d-th prime base. The scrambled variant
 * is random digit scrambling: every digit position j of every dimension gets its own seeded
 * random permutation of 0..b−1, applied to all digits down to double precision, including
 * the trailing zeros (Matoušek 1998, J. Complexity 14:527-556; the digit-permutation idea
 * Bhat 2003, Transportation Research B 37:837-855, used to break the correlation of high
 * bases). It keeps the stratification of the sequence and makes base 2 random too.
 */
import { createPrng } from './prng';

/** The first 100 primes, the Halton bases of dimensions 1..100. */
export const HALTON_PRIMES: readonly number[] = firstPrimes(100);

function firstPrimes(count: number): number[] {
  const primes: number[] = [];
  for (let candidate = 2; primes.length < count; candidate++) {
    if (primes.every((p) => p * p > candidate || candidate % p !== 0)) primes.push(candidate);
  }
  return primes;
}

/**
 * Radical inverse φ_b(i): the base-b digits of the integer i mirrored around the radix point.
 */
export function radicalInverse(index: number, base: number): number {
  let result = 0;
  let factor = 1 / base;
  let i = index;
  while (i > 0) {
    const digit = i % base;
    result += digit * factor;
    i = (i - digit) / base;
    factor /= base;
  }
  return result;
}

/** Per-dimension scrambling tables: `digits` positions × `base` entries, row-major. */
export interface HaltonScramble {
  base: number;
  digits: number;
  permutations: Int32Array;
  /** tail[j] = Σ_{m ≥ j} π_m(0)·b^−(m+1): the value of all-zero digits from position j on. */
  tail: Float64Array;
}

/**
 * Seeded random digit permutations for Halton dimensions 1..dimensions, one permutation of
 * 0..b−1 per digit position (Fisher-Yates), as many positions as resolve 2^−53.
 */
export function createHaltonScrambles(dimensions: number, seed: number): HaltonScramble[] {
  const prng = createPrng(seed, 0x4a17);
  const scrambles: HaltonScramble[] = [];
  for (let d = 0; d < dimensions; d++) {
    const base = HALTON_PRIMES[d];
    const digits = Math.ceil((53 * Math.LN2) / Math.log(base));
    const permutations = new Int32Array(digits * base);
    for (let j = 0; j < digits; j++) {
      const o = j * base;
      for (let k = 0; k < base; k++) permutations[o + k] = k;
      for (let k = base - 1; k > 0; k--) {
        const m = prng.nextUint32() % (k + 1);
        const tmp = permutations[o + k];
        permutations[o + k] = permutations[o + m];
        permutations[o + m] = tmp;
      }
    }
    const tail = new Float64Array(digits + 1);
    for (let j = digits - 1; j >= 0; j--)
      tail[j] = tail[j + 1] + permutations[j * base] * base ** -(j + 1);
    scrambles.push({ base, digits, permutations, tail });
  }
  return scrambles;
}

/** Scrambled radical inverse of `index`, strictly inside (0, 1). */
export function scrambledRadicalInverse(index: number, scramble: HaltonScramble): number {
  const { base, digits, permutations, tail } = scramble;
  let result = 0;
  let factor = 1 / base;
  let i = index;
  let j = 0;
  for (; i > 0 && j < digits; j++) {
    const digit = i % base;
    result += permutations[j * base + digit] * factor;
    i = (i - digit) / base;
    factor /= base;
  }
  // The remaining digits of the index are zeros; their permuted values are precomputed.
  result += tail[j];
  return result <= 0 ? 2 ** -53 : result >= 1 ? 1 - 2 ** -53 : result;
}
