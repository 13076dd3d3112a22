/**
 * Inverse normal and Halton points against published values.
 */
/* eslint-disable no-loss-of-precision -- reference values are quoted as published */
import { describe, expect, it } from 'vitest';
import { inverseNormal as getInverseNormal } from '../../../server/engine/draws/inverse-normal';
import { fillScrambledHalton } from '../../../server/engine/design/halton-draws';
import { createSeededRandom } from '../../../server/engine/design/seeded-random';

describe('getInverseNormal (Wichura 1988, AS241)', () => {
  // docs/methods.md "Draws" [C, mpmath]; one value per branch of the algorithm and a few common ones.
  it.each([
    [0.25, -0.67448975019608174],
    [0.95, 1.6448536269514727],
    [0.975, 1.9599639845400542],
    [0.99, 2.3263478740408411],
    [0.999, 3.0902323061678135],
    [1e-10, -6.3613409024040562],
    [1e-20, -9.2623400897984076],
    [1e-300, -37.047096299361199],
  ])('Φ⁻¹(%s) = %s to 1e-15 relative (AS241 claims ~1e-16)', (p, value) => {
    expect(Math.abs(getInverseNormal(p) - value) / Math.abs(value)).toBeLessThan(1e-15);
  });

  it('is infinite at 0 and 1 and NaN outside [0, 1]', () => {
    expect(getInverseNormal(0)).toBe(-Infinity);
    expect(getInverseNormal(1)).toBe(Infinity);
    expect(getInverseNormal(1.5)).toBeNaN();
  });
});

describe('fillScrambledHalton', () => {
  it('gives the van der Corput sequence in base 2 (no scrambling possible with one digit)', () => {
    // docs/methods.md "Draws" [R]: base 2: 1/2, 1/4, 3/4, 1/8, 5/8, 3/8, 7/8, 1/16, 9/16, 5/16.
    const out = new Float64Array(10);
    fillScrambledHalton(10, 1, out, { skip: 0 });
    expect(Array.from(out)).toEqual([
      0.5, 0.25, 0.75, 0.125, 0.625, 0.375, 0.875, 0.0625, 0.5625, 0.3125,
    ]);
  });

  it('permutes base-3 digits but keeps each block of 9 points stratified on the 1/9 grid', () => {
    // Halton property (Halton 1960): any b^m consecutive indices fill each interval
    // [k/b^m, (k+1)/b^m) once (the last m digits run through all values); a digit
    // permutation maps cells onto cells. Indices 1..9 are used here.
    const out = new Float64Array(2 * 9);
    fillScrambledHalton(9, 2, out, { skip: 0, seed: 3 });
    const cells = new Set(
      Array.from({ length: 9 }, (_, r) => Math.floor(out[r * 2 + 1] * 9 + 1e-9)),
    );
    expect(cells.size).toBe(9);
  });

  it('is reproducible for a seed', () => {
    const a = new Float64Array(30);
    const b = new Float64Array(30);
    fillScrambledHalton(10, 3, a, { seed: 11 });
    fillScrambledHalton(10, 3, b, { seed: 11 });
    expect(Array.from(a)).toEqual(Array.from(b));
  });
});

describe('createSeededRandom', () => {
  it('repeats its stream for a seed and differs across seeds', () => {
    const a = createSeededRandom(5);
    const b = createSeededRandom(5);
    const c = createSeededRandom(6);
    const sa = Array.from({ length: 5 }, () => a.next());
    expect(Array.from({ length: 5 }, () => b.next())).toEqual(sa);
    expect(Array.from({ length: 5 }, () => c.next())).not.toEqual(sa);
    expect(sa.every((v) => v >= 0 && v < 1)).toBe(true);
  });
});
