/* eslint-disable no-loss-of-precision -- reference values are kept verbatim as published in docs/methods.md "Draws". */
import { describe, expect, it } from 'vitest';
import { inverseNormal } from '../../../server/engine/draws/inverse-normal';

describe('inverseNormal (Wichura 1988, AS241 PPND16)', () => {
  // Reference values: docs/methods.md, "Draws" (Wichura 1988 AS 241; mpmath at 40-60 digits). PPND16 is accurate to
  // about 1 part in 1e16 (Wichura 1988), so a relative tolerance of 1e-15 is the method's error.
  it.each([
    ['central branch', 0.25, -0.67448975019608174],
    ['central branch', 0.95, 1.6448536269514727],
    ['central branch', 0.975, 1.9599639845400542],
    ['tail branch r <= 5', 0.99, 2.3263478740408411],
    ['tail branch r <= 5', 0.999, 3.0902323061678135],
    ['tail branch r <= 5', 0.001, -3.0902323061678135],
    ['tail branch r <= 5', 1e-10, -6.3613409024040562],
    ['far tail r > 5', 1e-20, -9.2623400897984076],
    ['far tail r > 5', 1e-300, -37.047096299361199],
  ])('%s: Φ⁻¹(%s)', (_branch, p, expected) => {
    const value = inverseNormal(p);
    expect(Math.abs(value - expected) / Math.abs(expected)).toBeLessThan(1e-15);
  });

  it('is exactly antisymmetric around 0.5 and zero at 0.5', () => {
    expect(inverseNormal(0.5)).toBe(0);
    expect(inverseNormal(0.3)).toBe(-inverseNormal(0.7));
  });

  it('returns infinities at 0 and 1 and NaN outside [0, 1]', () => {
    expect(inverseNormal(0)).toBe(-Infinity);
    expect(inverseNormal(1)).toBe(Infinity);
    expect(inverseNormal(1.5)).toBeNaN();
    expect(inverseNormal(Number.NaN)).toBeNaN();
  });
});
