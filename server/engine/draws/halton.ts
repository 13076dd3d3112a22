/**
 * Halton sequences (J. H. Halton, "On the efficiency of certain quasi-random sequences of
 * points in evaluating multi-dimensional integrals", Numer. Math. 2:84-90, 1960): dimension d
 * uses the radical inverse of the point index in the d-th prime base. The scrambled variant
 * permutes the digits 1..b−1 of every expansion with one seeded random permutation per
 * dimension (0 stays 0 so expansions stay finite), the digit-permutation idea Bhat (2003,
 * Transportation Research B 37:837-855) applied to break the correlation of high bases.
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
 * With `permutation`, each digit d is replaced by permutation[d] first.
 */
export function radicalInverse(index: number, base: number, permutation?: Int32Array): number {
  let result = 0;
  let factor = 1 / base;
  let i = index;
  while (i > 0) {
    const digit = i % base;
    result += (permutation ? permutation[digit] : digit) * factor;
    i = (i - digit) / base;
    factor /= base;
  }
  return result;
}

/**
 * Seeded digit permutations for Halton dimensions 1..dimensions (Fisher-Yates shuffle of
 * 1..b−1 with 0 fixed).
 */
export function createHaltonPermutations(dimensions: number, seed: number): Int32Array[] {
  const prng = createPrng(seed, 0x4a17);
  const permutations: Int32Array[] = [];
  for (let d = 0; d < dimensions; d++) {
    const base = HALTON_PRIMES[d];
    const perm = new Int32Array(base);
    for (let k = 0; k < base; k++) perm[k] = k;
    for (let k = base - 1; k > 1; k--) {
      const j = 1 + (prng.nextUint32() % k);
      const tmp = perm[k];
      perm[k] = perm[j];
      perm[j] = tmp;
    }
    permutations.push(perm);
  }
  return permutations;
}
