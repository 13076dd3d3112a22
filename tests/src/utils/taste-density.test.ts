import { describe, expect, it } from 'vitest';
import { conditionalDensity, populationDensity } from '@shared/results/taste-density';

// Moments by the midpoint rule on a fine grid; with 200,000 cells the error is far below 1e-3.
function moments(f: (x: number) => number, lo: number, hi: number) {
  const n = 200_000;
  const h = (hi - lo) / n;
  let m0 = 0;
  let m1 = 0;
  let m2 = 0;
  for (let i = 0; i < n; i++) {
    const x = lo + (i + 0.5) * h;
    const w = f(x) * h;
    m0 += w;
    m1 += w * x;
    m2 += w * x * x;
  }
  const mean = m1 / m0;
  return { mass: m0, mean, sd: Math.sqrt(m2 / m0 - mean * mean) };
}

describe('populationDensity', () => {
  const pop = (distribution: string, location: number, spread: number) => ({
    distribution,
    location,
    spread,
  });
  // Each density integrates to 1 (closed form).
  it.each([
    ['normal', pop('normal', 0.5, -0.4), -5, 6],
    ['lognormal', pop('lognormal', -1, 0.5), 0, 10],
    ['neg_lognormal', pop('neg_lognormal', -1.9, 0.5), -10, 0],
    ['triangular', pop('triangular', 1, 2), -2, 4],
    ['uniform', pop('uniform', 1, 2), -2, 4],
  ])('the %s density integrates to one', (_name, c, lo, hi) => {
    const m = moments((x) => populationDensity(c, x), lo as number, hi as number);
    expect(Math.abs(m.mass - 1)).toBeLessThan(1e-3);
  });

  it('gives the lognormal its closed-form mean exp(μ + σ²/2)', () => {
    // Closed form of the lognormal mean (Johnson, Kotz & Balakrishnan 1994, ch. 14).
    const m = moments((x) => populationDensity(pop('lognormal', -1, 0.5), x), 0, 20);
    expect(m.mean).toBeCloseTo(Math.exp(-1 + 0.125), 3);
  });
});

describe('conditionalDensity', () => {
  it('draws a lognormal coefficient on its own half-line with the stored mean and SD', () => {
    const f = (x: number) => conditionalDensity('lognormal', 0.8, 0.5, x);
    expect(f(-0.1)).toBe(0);
    const m = moments(f, 0, 15);
    expect(Math.abs(m.mass - 1)).toBeLessThan(1e-3);
    expect(m.mean).toBeCloseTo(0.8, 3);
    expect(m.sd).toBeCloseTo(0.5, 3);
  });

  it('mirrors a negative lognormal onto the negative half-line', () => {
    const f = (x: number) => conditionalDensity('neg_lognormal', -0.3, 0.2, x);
    expect(f(0.05)).toBe(0);
    const m = moments(f, -8, 0);
    expect(m.mean).toBeCloseTo(-0.3, 3);
    expect(m.sd).toBeCloseTo(0.2, 3);
  });

  it('is the normal with the stored mean and SD for coefficients on the whole line', () => {
    const m = moments((x) => conditionalDensity('normal', -0.4, 0.3, x), -4, 4);
    expect(m.mean).toBeCloseTo(-0.4, 4);
    expect(m.sd).toBeCloseTo(0.3, 4);
  });
});
