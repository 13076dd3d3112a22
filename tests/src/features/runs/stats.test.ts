import { describe, expect, it } from 'vitest';
import { densityHistogram, normalCdf, twoSidedP } from '@/features/runs/utils/stats';

describe('normalCdf and twoSidedP', () => {
  it('match the standard normal table', () => {
    // Standard normal table values (e.g. Abramowitz & Stegun 1964, table 26.1 [M]):
    // Φ(0) = 0.5, Φ(1) = 0.841345, Φ(1.959964) = 0.975, Φ(−2.575829) = 0.005.
    // Formula 7.1.26 is accurate to 1.5e-7 in erf, hence the 1e-6 tolerance.
    expect(normalCdf(0)).toBeCloseTo(0.5, 6);
    expect(Math.abs(normalCdf(1) - 0.841345)).toBeLessThan(1e-6);
    expect(Math.abs(normalCdf(1.959964) - 0.975)).toBeLessThan(1e-6);
    expect(Math.abs(normalCdf(-2.575829) - 0.005)).toBeLessThan(1e-6);
    expect(Math.abs(twoSidedP(1.959964) - 0.05)).toBeLessThan(2e-6);
  });
});

describe('densityHistogram', () => {
  it('has bars whose area is one', () => {
    const values = [0.1, 0.2, 0.2, 0.5, 0.9, 0.95];
    const bars = densityHistogram(values, 0, 1, 5);
    expect(bars.map((b) => b.x)).toEqual(
      [0.1, 0.3, 0.5, 0.7, 0.9].map((x) => expect.closeTo(x, 12)),
    );
    expect(bars.reduce((a, b) => a + b.y * 0.2, 0)).toBeCloseTo(1, 12);
    // Bins are closed on the left: 0.2 falls in the second bin.
    expect(bars[0].y).toBeCloseTo(1 / (6 * 0.2), 12);
    expect(bars[1].y).toBeCloseTo(2 / (6 * 0.2), 12);
  });
});
