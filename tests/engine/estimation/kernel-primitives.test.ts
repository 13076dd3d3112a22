import { describe, expect, it } from 'vitest';
import { createPrng } from '../../../server/engine/draws/prng';
import { expStream, expStreamAccumulate } from '../../../server/engine/linalg/exp-stream';
import { fusedAxpy } from '../../../server/engine/linalg/fused-axpy';

describe('expStream (Tang 1989 table-driven exp)', () => {
  it('agrees with Math.exp to a few ulps over [−700, 700] and clamps beyond', () => {
    // Error budget (standard rounding analysis, no source): rounding of the polynomial value, of the table entry
    // 2^(j/256) and of the final product, each at most one ulp, so ≤ 3 ulp = 3·2^−52.
    const prng = createPrng(12);
    const x = Float64Array.from({ length: 20000 }, () => (prng.nextDouble() - 0.5) * 1400);
    const expected = Array.from(x, Math.exp);
    expStream(x, 0, x.length);
    x.forEach((v, i) =>
      expect(Math.abs(v / expected[i] - 1)).toBeLessThan(3 * 2 ** -52 + 1e-300 / expected[i]),
    );
    const extreme = Float64Array.from([800, -800, 0]);
    expStream(extreme, 0, 3);
    expect(Math.abs(extreme[0] / Math.exp(700) - 1)).toBeLessThan(3 * 2 ** -52);
    expect(Math.abs(extreme[1] / Math.exp(-700) - 1)).toBeLessThan(3 * 2 ** -52);
    expect(extreme[2]).toBe(1);
  });

  it('expStreamAccumulate adds the exponentials into the accumulator', () => {
    const x = Float64Array.from([0, 1, -1]);
    const acc = Float64Array.from([1, 1, 1]);
    expStreamAccumulate(x, 0, 3, acc, 0);
    expect(acc[1]).toBeCloseTo(1 + Math.E, 15);
    expect(x[2]).toBeCloseTo(1 / Math.E, 15);
  });
});

describe('fusedAxpy', () => {
  it.each([0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 12, 13])(
    'equals the term-by-term sum with %i sources',
    (count) => {
      const prng = createPrng(count);
      const R = 17;
      const src = Float64Array.from({ length: 16 * R }, () => prng.nextDouble() - 0.5);
      const coef = Float64Array.from({ length: 16 }, () => prng.nextDouble() * 4 - 2);
      const offs = Int32Array.from({ length: 16 }, (_, i) => ((i * 7) % 16) * R);
      for (const assign of [true, false]) {
        const out = Float64Array.from({ length: R + 3 }, () => 1);
        fusedAxpy(out, 3, src, coef, offs, count, R, assign);
        for (let r = 0; r < R; r++) {
          let expected = assign ? 0 : 1;
          for (let i = 0; i < count; i++) expected += coef[i] * src[offs[i] + r];
          expect(out[3 + r]).toBeCloseTo(expected, 13);
        }
        expect([out[0], out[1], out[2]]).toEqual([1, 1, 1]);
      }
    },
  );
});
