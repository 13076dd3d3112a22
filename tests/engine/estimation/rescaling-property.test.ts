/**
 * Scale-free estimation (issue "Estimation that can be trusted on any data"): multiplying one
 * data column by 10^k, k = −6…6, must leave the LL unchanged (1e-8 relative), divide that
 * column's coefficient and its SE by 10^k (1e-6 relative) and change no other estimate (1e-6
 * relative). Source: invariance of maximum likelihood under reparameterisation (Greene 2018,
 * Econometric Analysis, 8th ed., §14.4.5, property M4) — β_x·x is what the likelihood sees.
 */
import { describe, expect, it } from 'vitest';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import { fitMixedLogit } from '../../../server/engine/estimation/fit-mixed-logit';
import { fitMnl } from '../../../server/engine/estimation/fit-mnl';
import { simulatePanelChoices } from '../../../server/engine/estimation/simulate-panel-choices';
import {
  fixedComfort,
  negLognormalPrice,
  normalQuality,
} from '../../../server/engine/estimation/simulate-choice-data';

const sim = simulatePanelChoices({
  respondents: 60,
  tasks: 6,
  alternatives: 3,
  coefficients: [normalQuality, fixedComfort, negLognormalPrice(0.4)],
  seed: 31,
});
const K_VALUES = [-6, -5, -4, -3, -2, -1, 0, 1, 2, 3, 4, 5, 6];

function scaledData(column: number, factor: number) {
  const rows = sim.rows.map((r) => ({
    ...r,
    values: Array.from(r.values, (v, k) => (k === column ? v * factor : v)),
  }));
  return buildChoiceData(sim.columns, rows).data;
}

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('rescaling a column by 10^k (k = −6…6)', () => {
  it('MNL: same LL, that coefficient and SE divided by 10^k, others unchanged', async () => {
    const base = await fitMnl(scaledData(0, 1));
    for (const k of K_VALUES) {
      const f = 10 ** k;
      const fit = await fitMnl(scaledData(0, f));
      expect(fit.converged).toBe(true);
      expect(rel(fit.loglik, base.loglik)).toBeLessThan(1e-8);
      expect(rel(fit.estimates[0] * f, base.estimates[0])).toBeLessThan(1e-6);
      expect(rel(fit.se[0] * f, base.se[0])).toBeLessThan(1e-6);
      expect(rel(fit.robustSe[0] * f, base.robustSe[0])).toBeLessThan(1e-6);
      for (const p of [1, 2]) {
        expect(rel(fit.estimates[p], base.estimates[p])).toBeLessThan(1e-6);
        expect(rel(fit.se[p], base.se[p])).toBeLessThan(1e-6);
      }
    }
  });

  it('mixed logit: same LL, the normal coefficient (mean, SD) and SEs divided by 10^k', async () => {
    const options = {
      coefficients: sim.columns.map((name, k) => ({
        name,
        distribution: (['normal', 'fixed', 'neg_lognormal'] as const)[k],
      })),
      draws: { count: 40, seed: 3 },
      starts: 1,
    };
    const base = await fitMixedLogit(scaledData(0, 1), options);
    // θ = [quality.mean, comfort, price.mean, quality.sd, price.sd]; quality's are 0 and 3.
    for (const k of K_VALUES) {
      const f = 10 ** k;
      const fit = await fitMixedLogit(scaledData(0, f), options);
      expect(fit.status).toBe('converged');
      expect(rel(fit.loglik, base.loglik)).toBeLessThan(1e-8);
      for (let p = 0; p < 5; p++) {
        const factor = p === 0 || p === 3 ? f : 1;
        expect(rel(fit.estimates[p] * factor, base.estimates[p])).toBeLessThan(1e-6);
        expect(rel(fit.robustSe[p] * factor, base.robustSe[p])).toBeLessThan(1e-6);
      }
    }
  }, 120_000);
});
