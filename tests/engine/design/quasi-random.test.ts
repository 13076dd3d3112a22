/**
 * Inverse normal against published values; the seeded generator of the demo data and the
 * respondents' plans. (The design engine's Halton points are the estimation's: tests/engine/draws.)
 */
/* eslint-disable no-loss-of-precision -- reference values are quoted as published */
import { describe, expect, it } from 'vitest';
import { inverseNormal as getInverseNormal } from '../../../server/engine/draws/inverse-normal';
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
