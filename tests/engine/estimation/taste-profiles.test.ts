import { describe, expect, it } from 'vitest';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import { EstimationCancelledError } from '../../../server/engine/estimation/estimation-errors';
import { createMixedLogitLayout } from '../../../server/engine/estimation/mixed-logit-layout';
import { getPopulationMoments } from '../../../server/engine/estimation/population-moments';
import {
  negLognormalPrice,
  normalQuality,
  simulateChoiceData,
} from '../../../server/engine/estimation/simulate-choice-data';
import type { TrueCoefficient } from '../../../server/engine/estimation/simulate-panel-choices';
import { computeTasteProfiles } from '../../../server/engine/estimation/taste-profiles';
import { pearson } from '../../support/pearson';

const truth: TrueCoefficient[] = [normalQuality, negLognormalPrice(0.6)];
const coefficients = truth.map(({ name, distribution }) => ({ name, distribution }));
const trueTheta = [1.0, -0.5, 0.8, 0.6];

/** Profiles at the TRUE population parameters, so only the number of tasks varies. */
function profilesFor(tasks: number) {
  const { sim, data } = simulateChoiceData({
    respondents: 300,
    tasks,
    alternatives: 3,
    coefficients: truth,
    seed: 8,
  });
  const layout = createMixedLogitLayout(data, coefficients, false);
  const result = computeTasteProfiles(data, layout, trueTheta, { count: 500, cost: 'price' });
  const trueQuality = Array.from({ length: 300 }, (_, n) => sim.trueBetas[n * 2]);
  return { result, trueQuality };
}

describe('computeTasteProfiles (Revelt & Train 2000; Train 2009 ch. 11)', () => {
  const few = profilesFor(2);
  const many = profilesFor(20);

  it('correlation between true coefficients and conditional means rises with the number of tasks', () => {
    // Common practice, no source: more choices per person → posterior closer to the truth.
    const rFew = pearson(
      few.trueQuality,
      few.result.profiles.map((p) => p.mean.quality),
    );
    const rMany = pearson(
      many.trueQuality,
      many.result.profiles.map((p) => p.mean.quality),
    );
    expect(rMany).toBeGreaterThan(rFew + 0.2);
    expect(rMany).toBeGreaterThan(0.7);
  });

  it('the average conditional mean is close to the population mean (docs/methods.md "Estimation check values" invariant)', () => {
    // E_y[E(β|y)] = E(β) = 1.0; sampling SE of the average over 300 people ≈ 0.8/√300 = 0.046, 3 SE.
    for (const { result } of [few, many]) {
      const avg = result.profiles.reduce((s, p) => s + p.mean.quality, 0) / result.profiles.length;
      expect(Math.abs(avg - 1.0)).toBeLessThan(3 * 0.046);
    }
  });

  it('conditional means are spread less than the population, and conditional SDs shrink with tasks', () => {
    // Var(β) = E[Var(β|y)] + Var(E[β|y]) (docs/methods.md "Estimation check values" [M], Train ch. 11).
    const sdOfMeans = (ps: typeof few.result.profiles) => {
      const m = ps.reduce((s, p) => s + p.mean.quality, 0) / ps.length;
      return Math.sqrt(ps.reduce((s, p) => s + (p.mean.quality - m) ** 2, 0) / ps.length);
    };
    const avgSd = (ps: typeof few.result.profiles) =>
      ps.reduce((s, p) => s + p.sd.quality, 0) / ps.length;
    expect(sdOfMeans(few.result.profiles)).toBeLessThan(0.8);
    expect(avgSd(many.result.profiles)).toBeLessThan(avgSd(few.result.profiles));
    for (const p of few.result.profiles) expect(p.sd.quality).toBeLessThan(0.8 * 1.2);
  });

  it('reports WTP per respondent as the weighted mean of per-draw ratios and the effective draws', () => {
    for (const p of many.result.profiles.slice(0, 20)) {
      expect(p.wtp).toBeDefined();
      expect(Object.keys(p.wtp!)).toEqual(['quality']);
      expect(p.mean.price).toBeLessThan(0);
      expect(p.effectiveDraws).toBeGreaterThanOrEqual(1);
      expect(p.effectiveDraws).toBeLessThanOrEqual(500);
    }
    expect(many.result.draws).toEqual({ type: 'halton', count: 500, seed: 7, scrambled: true });
  });

  it('stops with EstimationCancelledError when the signal has fired', () => {
    const { data } = simulateChoiceData({
      respondents: 10,
      tasks: 2,
      alternatives: 2,
      coefficients: truth,
      seed: 1,
    });
    const layout = createMixedLogitLayout(data, coefficients, false);
    const controller = new AbortController();
    controller.abort();
    expect(() =>
      computeTasteProfiles(data, layout, trueTheta, { signal: controller.signal }),
    ).toThrow(EstimationCancelledError);
  });

  it('population moments follow the closed forms (lognormal: e^{b+s²/2}, SD √(e^{s²}−1)·mean)', () => {
    // Johnson, Kotz & Balakrishnan 1994, ch. 14.
    const [quality, price] = getPopulationMoments(
      createMixedLogitLayout(
        buildChoiceData(
          ['quality', 'price'],
          [
            { respondent: 1, task: 1, alt: 1, chosen: 1, values: [1, 1] },
            { respondent: 1, task: 1, alt: 2, chosen: 0, values: [0, 0] },
          ],
        ).data,
        coefficients,
        false,
      ),
      trueTheta,
    );
    expect(quality).toMatchObject({ mean: 1.0, sd: 0.8 });
    expect(price.mean).toBeCloseTo(-Math.exp(-0.5 + 0.18), 14);
    expect(price.sd).toBeCloseTo(Math.sqrt(Math.exp(0.36) - 1) * Math.exp(-0.5 + 0.18), 14);
  });
});
