/**
 * A run names its stages after the optimisation (standard errors, WTP, taste profiles) so the
 * progress shown to the analyst never goes silent at the end.
 */
import { describe, expect, it } from 'vitest';
import { estimationSpecSchema } from '../../../shared/schemas/estimation-spec';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import { runEstimation } from '../../../server/engine/estimation/run-estimation';
import { simulatePanelChoices } from '../../../server/engine/estimation/simulate-panel-choices';

const sim = simulatePanelChoices({
  respondents: 60,
  tasks: 6,
  alternatives: 3,
  coefficients: [
    { name: 'quality', distribution: 'normal', location: 1.0, spread: 0.6 },
    { name: 'cost', distribution: 'fixed', location: -0.8, levels: [0, 1, 2, 3] },
  ],
  seed: 3,
});
const built = buildChoiceData(sim.columns, sim.rows);

describe('run stages', () => {
  it('reports standard errors, WTP and taste profiles in that order, after every iteration', async () => {
    const events: string[] = [];
    await runEstimation(
      estimationSpecSchema.parse({
        model: 'mixed',
        coefficients: [
          { name: 'quality', distribution: 'normal' },
          { name: 'cost', distribution: 'fixed' },
        ],
        cost: 'cost',
        draws: { count: 30, seed: 1 },
        starts: 1,
        profileDraws: 30,
      }),
      built,
      {
        onProgress: () => {
          if (events.at(-1) !== 'iteration') events.push('iteration');
        },
        onStage: (stage) => events.push(stage),
      },
    );
    expect(events).toEqual(['iteration', 'standard_errors', 'wtp', 'profiles']);
  });
});
