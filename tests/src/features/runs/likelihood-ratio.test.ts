/**
 * Likelihood-ratio tests between runs. Check value: the 95 % quantile of χ²(1) is
 * 3.841458820694124 (standard χ² tables, e.g. Abramowitz & Stegun 1964 Table 26.8), so that LR
 * gives p = 0.05; nesting follows the rules in src/features/runs/utils/likelihood-ratio.ts.
 */
import { describe, expect, it } from 'vitest';
import type { Run, RunResult } from '@shared/schemas/run';
import { compareRuns } from '@/features/runs/utils/likelihood-ratio';

function makeRun(
  name: string,
  coefficients: { name: string; distribution: string }[],
  loglik: number,
  parameters: number,
  dataHash = 'abc',
): Run & { results: RunResult } {
  return {
    id: name,
    name,
    model: coefficients.some((c) => c.distribution !== 'fixed') ? 'mixed' : 'mnl',
    dataHash,
    spec: { coefficients, correlated: false, space: 'preference' },
    results: { loglik, parameters },
  } as unknown as Run & { results: RunResult };
}

describe('compareRuns', () => {
  const mnl = makeRun(
    'MNL',
    [
      { name: 'a', distribution: 'fixed' },
      { name: 'b', distribution: 'fixed' },
    ],
    -100,
    2,
  );

  it('finds the MNL nested in a mixed logit and gives p = 0.05 at LR = 3.8415 with df 1', () => {
    const mixed = makeRun(
      'Mixed',
      [
        { name: 'a', distribution: 'normal' },
        { name: 'b', distribution: 'fixed' },
      ],
      -100 + 3.841458820694124 / 2,
      3,
    );
    const t = compareRuns(mnl, mixed);
    expect(t.nested).toBe(true);
    if (!t.nested) return;
    expect(t.restricted.name).toBe('MNL');
    expect(t.df).toBe(1);
    expect(t.p).toBeCloseTo(0.05, 10);
    expect(t.boundary).toBe(true);
  });

  it('a model with a coefficient left out is nested (df = the parameters left out)', () => {
    const small = makeRun('Small', [{ name: 'a', distribution: 'fixed' }], -110, 1);
    const t = compareRuns(small, mnl);
    expect(t.nested && t.df === 1 && t.statistic === 20).toBe(true);
  });

  it('says why runs are not nested: other data, or distributions that do not nest', () => {
    const other = makeRun('Other data', [{ name: 'a', distribution: 'fixed' }], -90, 1, 'zzz');
    const t1 = compareRuns(other, mnl);
    expect(t1.nested === false && t1.reason).toMatch(/different data/);
    const logn = makeRun(
      'Logn',
      [
        { name: 'a', distribution: 'lognormal' },
        { name: 'b', distribution: 'fixed' },
      ],
      -95,
      3,
    );
    const norm = makeRun(
      'Norm',
      [
        { name: 'a', distribution: 'normal' },
        { name: 'b', distribution: 'fixed' },
      ],
      -96,
      3,
    );
    const t2 = compareRuns(logn, norm);
    expect(t2.nested === false && t2.reason).toMatch(/neither distribution is a special case/);
  });

  it('offers no LR test with an HB run (no maximised LL) or a latent class run (classes on the boundary)', () => {
    const fixed = [
      { name: 'a', distribution: 'fixed' },
      { name: 'b', distribution: 'fixed' },
    ];
    const lc = { ...makeRun('LC', fixed, -90, 5), model: 'latent_class' } as typeof mnl;
    const hb = {
      ...makeRun('HB', [{ name: 'a', distribution: 'normal' }, fixed[1]], -95, 3),
      model: 'hb',
    } as typeof mnl;
    const withLc = compareRuns(mnl, lc);
    expect(withLc.nested).toBe(false);
    if (!withLc.nested) expect(withLc.reason).toMatch(/BIC and CAIC/);
    const withHb = compareRuns(mnl, hb);
    expect(withHb.nested).toBe(false);
    if (!withHb.nested) expect(withHb.reason).toMatch(/log marginal density/);
  });
});
