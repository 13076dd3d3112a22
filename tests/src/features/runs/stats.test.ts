import { describe, expect, it } from 'vitest';
import {
  densityHistogram,
  normalCdf,
  populationDensity,
  twoSidedP,
} from '@/features/runs/utils/stats';

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

describe('populationDensity', () => {
  const moment = (
    distribution: string,
    location: number,
    spread: number,
    mean = location,
    sd = 0,
  ) =>
    ({ name: 'x', distribution, location, spread, mean, sd }) as Parameters<
      typeof populationDensity
    >[0];
  // Each density integrates to 1 (closed form); midpoint rule on a fine grid, error < 1e-3.
  const integrate = (m: Parameters<typeof populationDensity>[0], lo: number, hi: number) => {
    const n = 200_000;
    const h = (hi - lo) / n;
    let s = 0;
    for (let i = 0; i < n; i++) s += populationDensity(m, lo + (i + 0.5) * h) * h;
    return s;
  };
  it.each([
    ['normal', moment('normal', 0.5, 0.4, 0.5, 0.4), -5, 6],
    ['lognormal', moment('lognormal', -1, 0.5), 0, 10],
    ['neg_lognormal', moment('neg_lognormal', -1.9, 0.5), -10, 0],
    ['triangular', moment('triangular', 1, 2), -2, 4],
    ['uniform', moment('uniform', 1, 2), -2, 4],
  ])('the %s density integrates to one', (_name, m, lo, hi) => {
    expect(Math.abs(integrate(m, lo as number, hi as number) - 1)).toBeLessThan(1e-3);
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
