import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { computeEss, computeSplitRhat } from '../../../server/engine/hb/mcmc-diagnostics';

/** Seeded AR(1) chains and ArviZ 0.23.4's split R-hat and ESS of them (scripts/reference/hb-diagnostics.py). */
const fixture = JSON.parse(
  readFileSync(
    path.resolve(import.meta.dirname, '../../fixtures/estimation/hb-diagnostics-reference.json'),
    'utf8',
  ),
) as { cases: { name: string; chains: number[][]; rhat: number | null; ess: number }[] };

describe('MCMC diagnostics against ArviZ (rhat method "split", ess method "mean")', () => {
  for (const c of fixture.cases) {
    it(c.name, () => {
      const chains = c.chains.map((x) => Float64Array.from(x));
      // Same formulas in double precision; ArviZ's FFT autocovariance differs by rounding only.
      if (c.rhat !== null) expect(computeSplitRhat(chains)).toBeCloseTo(c.rhat, 10);
      expect(computeEss(chains)).toBeCloseTo(c.ess, 8);
    });
  }

  it('flags chains that have not met (R-hat well above 1.05) and reports ESS far below the draw count', () => {
    const shifted = fixture.cases.find((c) => c.name.includes('shifted'))!;
    const chains = shifted.chains.map((x) => Float64Array.from(x));
    expect(computeSplitRhat(chains)).toBeGreaterThan(1.05);
    expect(computeEss(chains)).toBeLessThan(600 / 10);
  });
});
