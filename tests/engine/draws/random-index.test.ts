/**
 * Uniform integers and shuffles from the seeded generator: exact unbiasedness by Lemire's
 * rejection rule (Lemire 2019, ACM TOMS 29(1), Algorithm 5) and Fisher–Yates permutations.
 */
import { describe, expect, it } from 'vitest';
import { createPrng, type Prng } from '../../../server/engine/draws/prng';
import { randomIndex, shuffleInPlace } from '../../../server/engine/draws/random-index';

/** A generator that returns the given 32-bit words in turn. */
const scripted = (...words: number[]): Prng => {
  let i = 0;
  return { nextUint32: () => words[i++], nextDouble: () => Number.NaN };
};

describe('randomIndex', () => {
  it('maps a word x to floor(x·n / 2³²) when its low product is at least n (closed form)', () => {
    expect(randomIndex(scripted(0xffffffff), 10)).toBe(9);
    expect(randomIndex(scripted(0x80000001), 10)).toBe(5);
    expect(randomIndex(scripted(0x1999999b), 10)).toBe(1);
  });

  it('rejects the words whose low product falls below (2³² − n) mod n, and only those', () => {
    // n = 3: threshold = (2³² − 3) mod 3 = 1, so only a low product of 0 (x = 0) is redrawn.
    expect(randomIndex(scripted(0, 0x55555556), 3)).toBe(1);
    // n = 6: threshold = (2³² − 6) mod 6 = 4; x = 0x80000000 gives low product 0 → redrawn.
    expect(randomIndex(scripted(0x80000000, 0xffffffff), 6)).toBe(5);
    // x = 1 gives low product 6 ≥ 4: kept.
    expect(randomIndex(scripted(1), 6)).toBe(0);
  });

  it('is uniform: 60,000 draws on 0..5 pass a χ² test at the 0.1 % level', () => {
    const prng = createPrng(42);
    const counts = new Array(6).fill(0);
    for (let i = 0; i < 60_000; i++) counts[randomIndex(prng, 6)]++;
    const chi2 = counts.reduce((s, c) => s + (c - 10_000) ** 2 / 10_000, 0);
    // χ²(5) upper 0.1 % point 20.515 (Pearson & Hartley, Biometrika Tables, Table 8).
    expect(chi2).toBeLessThan(20.515);
  });
});

describe('shuffleInPlace', () => {
  it('permutes only the given range, and repeats for a seed', () => {
    const a = Int32Array.from({ length: 10 }, (_, i) => i);
    const b = Int32Array.from(a);
    shuffleInPlace(createPrng(3), a, 2, 6);
    shuffleInPlace(createPrng(3), b, 2, 6);
    expect(Array.from(a)).toEqual(Array.from(b));
    expect([a[0], a[1], a[8], a[9]]).toEqual([0, 1, 8, 9]);
    expect(Array.from(a.slice(2, 8)).sort((x, y) => x - y)).toEqual([2, 3, 4, 5, 6, 7]);
  });

  it('gives each of the 6 orders of 3 items equally often (χ², 0.1 % level)', () => {
    const prng = createPrng(9);
    const counts = new Map<string, number>();
    for (let i = 0; i < 60_000; i++) {
      const v = [0, 1, 2];
      shuffleInPlace(prng, v);
      counts.set(v.join(''), (counts.get(v.join('')) ?? 0) + 1);
    }
    expect(counts.size).toBe(6);
    const chi2 = [...counts.values()].reduce((s, c) => s + (c - 10_000) ** 2 / 10_000, 0);
    expect(chi2).toBeLessThan(20.515); // χ²(5), as above
  });
});
