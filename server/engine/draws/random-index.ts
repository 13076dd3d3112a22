/**
 * Uniform integers and shuffles from the one seeded generator (draws/prng.ts): the design
 * engine's level picks, block swaps and Fisher–Yates shuffles, the respondents' task and
 * alternative orders, and the demo's simulated people all draw through here.
 */
import type { Prng } from './prng';

const TWO_32 = 4294967296;

/**
 * Uniform integer on 0..n−1 (n ≤ 2²¹), exactly unbiased: Lemire's multiply-shift with its
 * rejection step (D. Lemire, "Fast random integer generation in an interval", ACM TOMS 29(1),
 * 2019, Algorithm 5). Products stay below 2⁵³, so doubles hold them exactly.
 */
export function randomIndex(prng: Prng, n: number): number {
  let m = prng.nextUint32() * n;
  let low = m % TWO_32;
  if (low < n) {
    const threshold = (TWO_32 - n) % n;
    while (low < threshold) {
      m = prng.nextUint32() * n;
      low = m % TWO_32;
    }
  }
  return Math.floor(m / TWO_32);
}

/** Fisher–Yates shuffle (Knuth, TAOCP vol. 2, Algorithm 3.4.2P) of `values[offset, offset+length)`. */
export function shuffleInPlace(
  prng: Prng,
  values: Int32Array | number[],
  offset = 0,
  length = values.length - offset,
): void {
  shuffleWith((n) => randomIndex(prng, n), values, offset, length);
}

/**
 * The same Fisher–Yates shuffle with any source of indices on 0..n−1: lets a stored seed of an
 * earlier generator version (draws/legacy-sfc32.ts) rebuild what it shuffled.
 */
export function shuffleWith(
  pickIndex: (n: number) => number,
  values: Int32Array | number[],
  offset = 0,
  length = values.length - offset,
): void {
  for (let i = length - 1; i > 0; i--) {
    const k = pickIndex(i + 1);
    const t = values[offset + i];
    values[offset + i] = values[offset + k];
    values[offset + k] = t;
  }
}
