import { describe, expect, it } from 'vitest';
import { createHaltonPermutations, radicalInverse } from '../../../server/engine/draws/halton';

describe('radicalInverse (Halton 1960)', () => {
  // Values: REFERENCES.md §3.3 [R] (independent documents), first ten points after 0.
  const base2 = [1 / 2, 1 / 4, 3 / 4, 1 / 8, 5 / 8, 3 / 8, 7 / 8, 1 / 16, 9 / 16, 5 / 16];
  const base3 = [1 / 3, 2 / 3, 1 / 9, 4 / 9, 7 / 9, 2 / 9, 5 / 9, 8 / 9, 1 / 27, 10 / 27];
  const base5 = [0.2, 0.4, 0.6, 0.8, 0.04, 0.24, 0.44, 0.64, 0.84, 0.08];

  it.each([
    [2, base2],
    [3, base3],
    [5, base5],
  ])('reproduces the published base-%i sequence', (base, expected) => {
    expected.forEach((value, i) => expect(radicalInverse(i + 1, base)).toBeCloseTo(value, 15));
  });

  it('with a permutation keeps every point of a full cycle distinct (a permutation of the digits)', () => {
    const [p2, p3, p5] = createHaltonPermutations(3, 7);
    expect(p2[0]).toBe(0);
    const points = Array.from({ length: 125 }, (_, i) => radicalInverse(i, 5, p5));
    expect(new Set(points.map((x) => x.toFixed(12))).size).toBe(125);
    expect(p3[0]).toBe(0);
    expect([...p5].sort()).toEqual([0, 1, 2, 3, 4]);
  });

  it('scrambling is seeded: the same seed gives the same permutations, another seed differs', () => {
    const a = createHaltonPermutations(10, 1);
    const b = createHaltonPermutations(10, 1);
    const c = createHaltonPermutations(10, 2);
    expect(a.map((p) => [...p])).toEqual(b.map((p) => [...p]));
    expect(a.map((p) => [...p])).not.toEqual(c.map((p) => [...p]));
  });
});
