/**
 * WTP space (Train & Weeks 2005): a reparameterisation of preference space, so for equivalent
 * specifications the maximum of the likelihood is the same (invariance of ML, Greene 2018
 * §14.4.5) and w_k = −β_k/β_cost: an MNL, and a mixed logit with a fixed cost and a normal
 * WTP (β_k = −β_cost·w_k is then normal with mean −β_cost·m and SD |β_cost|·s, on the same draws).
 */
import { describe, expect, it } from 'vitest';
import { estimationSpecSchema } from '../../../shared/schemas/estimation-spec';
import { runEstimation } from '../../../server/engine/estimation/run-estimation';
import { simulateChoiceData } from '../../../server/engine/estimation/simulate-choice-data';

const { built } = simulateChoiceData({
  respondents: 120,
  tasks: 8,
  alternatives: 3,
  coefficients: [
    { name: 'quality', distribution: 'normal', location: 1.0, spread: 0.6 },
    { name: 'cost', distribution: 'fixed', location: -0.8, levels: [0, 1, 2, 3] },
  ],
  seed: 8,
});

describe('WTP space', () => {
  it('MNL: same LL as preference space, w = −β/β_cost, with standard errors', async () => {
    const base = {
      model: 'mnl',
      coefficients: [{ name: 'quality' }, { name: 'cost' }],
      cost: 'cost',
    };
    const pref = await runEstimation(estimationSpecSchema.parse(base), built);
    const wtp = await runEstimation(estimationSpecSchema.parse({ ...base, space: 'wtp' }), built);
    expect(wtp.loglik).toBeCloseTo(pref.loglik, 10);
    expect(wtp.estimates[0].estimate).toBeCloseTo(
      -pref.estimates[0].estimate / pref.estimates[1].estimate,
      10,
    );
    expect(wtp.estimates[0].se).toBeGreaterThan(0);
    // The WTP-space parameter and the preference-space WTP's delta SE are the same quantity.
    expect(wtp.estimates[0].robustSe!).toBeCloseTo(pref.wtp![0].se!, 8);
  });

  it('mixed logit with a fixed cost: same maximum LL as the normal preference-space model', async () => {
    const spec = {
      model: 'mixed',
      coefficients: [
        { name: 'quality', distribution: 'normal' },
        { name: 'cost', distribution: 'fixed' },
      ],
      cost: 'cost',
      draws: { count: 50, seed: 2 },
      starts: 1,
      profileDraws: 50,
    };
    // The run also names its stages after the optimisation, so progress never goes silent.
    const stages: string[] = [];
    const pref = await runEstimation(estimationSpecSchema.parse(spec), built, {
      onStage: (stage) => stages.push(stage),
    });
    expect(stages).toEqual(['standard_errors', 'wtp', 'profiles']);
    const wtp = await runEstimation(estimationSpecSchema.parse({ ...spec, space: 'wtp' }), built);
    expect(pref.converged && wtp.converged).toBe(true);
    expect(Math.abs(wtp.loglik - pref.loglik)).toBeLessThan(1e-6);
    const [mean, cost, sd] = [0, 1, 2].map((i) => pref.estimates[i].estimate);
    expect(wtp.estimates[0].estimate).toBeCloseTo(-mean / cost, 4);
    expect(Math.abs(wtp.estimates[2].estimate)).toBeCloseTo(Math.abs(sd / cost), 4);
    expect(wtp.estimates.every((e) => e.se !== null && e.se > 0)).toBe(true);
  }, 60_000);
});
