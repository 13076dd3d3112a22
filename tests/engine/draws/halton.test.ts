import { describe, expect, it } from 'vitest';
import {
  createHaltonScrambles,
  radicalInverse,
  scrambledRadicalInverse,
} from '../../../server/engine/draws/halton';

describe('radicalInverse (Halton 1960)', () => {
  // Values: closed form of the radical inverse (Train 2009 §9.3.3; docs/methods.md, "Draws"), first ten points after 0.
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

  it('scrambling keeps the stratification: b^m consecutive points fill the b^m strata once', () => {
    // Random digit scrambling permutes digits position by position, so the first m digits of
    // points 0..b^m−1 stay a permutation of all m-digit strings (Matoušek 1998).
    const [s2, s3, s5] = createHaltonScrambles(3, 7);
    for (const [scramble, m] of [
      [s2, 7],
      [s3, 4],
      [s5, 3],
    ] as const) {
      const cells = scramble.base ** m;
      const strata = Array.from({ length: cells }, (_, i) =>
        Math.floor(scrambledRadicalInverse(i, scramble) * cells),
      );
      expect(new Set(strata).size).toBe(cells);
    }
  });

  it('scrambling is seeded: the same seed gives the same points, another seed differs, base 2 included', () => {
    const a = createHaltonScrambles(3, 1);
    const b = createHaltonScrambles(3, 1);
    const c = createHaltonScrambles(3, 2);
    const points = (s: ReturnType<typeof createHaltonScrambles>) =>
      s.map((x) => scrambledRadicalInverse(11, x));
    expect(points(a)).toEqual(points(b));
    points(a).forEach((u, d) => expect(u).not.toBe(points(c)[d]));
  });
});
