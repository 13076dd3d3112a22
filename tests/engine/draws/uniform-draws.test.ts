import { describe, expect, it } from 'vitest';
import {
  fillUniformDraws,
  HALTON_SKIP,
  type DrawsType,
} from '../../../server/engine/draws/uniform-draws';
import { radicalInverse } from '../../../server/engine/draws/halton';

const types: DrawsType[] = ['halton', 'sobol', 'mlhs', 'random'];

describe('fillUniformDraws (panel draws)', () => {
  it('plain Halton gives respondent n the consecutive block after the skipped points (Train 2009 §9.3.3)', () => {
    const R = 5;
    const out = new Float64Array(2 * 2 * R);
    fillUniformDraws(
      { type: 'halton', count: R, dimensions: 2, seed: 1, scrambled: false },
      0,
      2,
      out,
    );
    expect(out[0]).toBe(radicalInverse(HALTON_SKIP + 1, 2));
    expect(out[R]).toBe(radicalInverse(HALTON_SKIP + 1, 3));
    expect(out[2 * R]).toBe(radicalInverse(HALTON_SKIP + R + 1, 2));
  });

  it.each(types)('%s: chunked filling equals filling all respondents at once', (type) => {
    const spec = { type, count: 7, dimensions: 3, seed: 42 };
    const all = new Float64Array(5 * 3 * 7);
    fillUniformDraws(spec, 0, 5, all);
    const tail = new Float64Array(2 * 3 * 7);
    fillUniformDraws(spec, 3, 2, tail);
    expect([...tail]).toEqual([...all.subarray(3 * 21)]);
    expect(all.every((u) => u > 0 && u < 1)).toBe(true);
  });

  it.each(types)('%s: sample mean of many draws is close to 1/2', (type) => {
    const out = new Float64Array(20 * 2 * 100);
    fillUniformDraws({ type, count: 100, dimensions: 2, seed: 3 }, 0, 20, out);
    const mean = out.reduce((a, b) => a + b, 0) / out.length;
    // Pseudo-random: SE of the mean of 4000 U(0,1) is 0.0046, so 4 SE (common practice, no source).
    expect(Math.abs(mean - 0.5)).toBeLessThan(0.0183);
  });

  it('MLHS puts exactly one draw in each of the R strata of every dimension (Hess, Train & Polak 2006)', () => {
    const R = 50;
    const out = new Float64Array(R * 2);
    fillUniformDraws({ type: 'mlhs', count: R, dimensions: 2, seed: 9 }, 0, 1, out);
    for (let d = 0; d < 2; d++) {
      const strata = [...out.subarray(d * R, (d + 1) * R)]
        .map((u) => Math.floor(u * R))
        .sort((a, b) => a - b);
      expect(strata).toEqual(Array.from({ length: R }, (_, i) => i));
    }
  });
});
