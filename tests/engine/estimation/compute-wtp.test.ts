import { describe, expect, it } from 'vitest';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import { computeWtp } from '../../../server/engine/estimation/compute-wtp';
import { uncorrelatedLayout } from './uncorrelated-layout';

const data = buildChoiceData(
  ['quality', 'bill'],
  [
    { respondent: 1, task: 1, alt: 1, chosen: 1, values: [1, 3] },
    { respondent: 1, task: 1, alt: 2, chosen: 0, values: [0, 0] },
  ],
).data;

describe('computeWtp', () => {
  it('Check I (docs/methods.md "Willingness to pay" [C]): WTP = 20.0, delta-method SE = 6.020797289396148', () => {
    const layout = uncorrelatedLayout(data, { quality: 'fixed', bill: 'fixed' });
    const cov = Float64Array.from([0.01, 0.0002, 0.0002, 0.0001]);
    const [wtp] = computeWtp(layout, [0.8, -0.04], cov, { cost: 'bill', draws: 20000, seed: 3 });
    expect(wtp.name).toBe('quality');
    expect(wtp.estimate).toBeCloseTo(20.0, 12);
    expect(wtp.se).toBeCloseTo(6.020797289396148, 12);
    expect(wtp.deltaLower).toBeCloseTo(20 - 1.959963984540054 * 6.020797289396148, 10);
    // Krinsky-Robb interval: the ratio is skewed here (cost t-ratio 4), so the percentile
    // interval is shifted right of the symmetric delta interval (Hole 2007).
    expect(wtp.lower).toBeLessThan(20);
    expect(wtp.upper).toBeGreaterThan(wtp.deltaUpper);
  });

  it('Krinsky-Robb and delta intervals agree when the cost coefficient is precise (Hole 2007)', () => {
    const layout = uncorrelatedLayout(data, { quality: 'fixed', bill: 'fixed' });
    const cov = Float64Array.from([0.0004, 0, 0, 1e-8]);
    const [wtp] = computeWtp(layout, [0.8, -0.04], cov, { cost: 'bill', draws: 20000, seed: 3 });
    // SE ≈ 0.5; percentile error with 20000 draws ≈ 0.01·SE-scale; allow 3% of the width.
    const width = wtp.deltaUpper - wtp.deltaLower;
    expect(Math.abs(wtp.lower - wtp.deltaLower)).toBeLessThan(0.03 * width);
    expect(Math.abs(wtp.upper - wtp.deltaUpper)).toBeLessThan(0.03 * width);
  });

  it('uses the population mean −exp(b + s²/2) for a neg_lognormal cost, with its delta gradient', () => {
    const layout = uncorrelatedLayout(data, { quality: 'normal', bill: 'neg_lognormal' });
    const theta = [0.8, -1, 0.5, 0.4];
    const cov = new Float64Array(16);
    [0.01, 0.02, 0.004, 0.003].forEach((v, i) => (cov[i * 4 + i] = v));
    const [wtp] = computeWtp(layout, theta, cov, { cost: 'bill' });
    const meanCost = -Math.exp(-1 + 0.08);
    expect(wtp.estimate).toBeCloseTo(-0.8 / meanCost, 12);
    // g = −b_q / μ_c: ∂g/∂b_q = −1/μ_c, ∂g/∂b_c = g, ∂g/∂s_c = s·g (closed form).
    const g = -0.8 / meanCost;
    const variance = 0.01 / meanCost ** 2 + g * g * 0.02 + (0.4 * g) ** 2 * 0.003;
    expect(wtp.se).toBeCloseTo(Math.sqrt(variance), 12);
  });
});
