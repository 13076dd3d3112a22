/**
 * The estimation thread passes every kind of progress across its port, including the stages
 * after the optimisation, so the run's progress names them while the thread works.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { estimationSpecSchema } from '../../../shared/schemas/estimation-spec';
import { simulateChoiceData } from '../../../server/engine/estimation/simulate-choice-data';
import {
  createEstimationPool,
  runEstimationInWorker,
} from '../../../server/engine/parallel/run-estimation-in-worker';

const pool = createEstimationPool();
afterAll(() => pool.destroy());

describe('estimation thread', () => {
  it('reports iterations, then standard errors, WTP and taste profiles', async () => {
    const { built } = simulateChoiceData({
      respondents: 40,
      tasks: 6,
      alternatives: 3,
      coefficients: [
        { name: 'comfort', distribution: 'normal', location: 0.8, spread: 0.5 },
        { name: 'fare', distribution: 'fixed', location: -0.6, levels: [0, 1, 2] },
      ],
      seed: 21,
    });
    const spec = estimationSpecSchema.parse({
      model: 'mixed',
      coefficients: [
        { name: 'comfort', distribution: 'normal' },
        { name: 'fare', distribution: 'fixed' },
      ],
      cost: 'fare',
      draws: { count: 20, seed: 5 },
      starts: 1,
      profileDraws: 20,
    });
    const events: string[] = [];
    const result = await runEstimationInWorker(
      pool,
      { spec, built, threads: 1 },
      {
        onProgress: () => {
          if (events.at(-1) !== 'iteration') events.push('iteration');
        },
        onStage: (stage) => events.push(stage),
      },
    );
    expect(result.individuals).toHaveLength(40);
    expect(events).toEqual(['iteration', 'standard_errors', 'wtp', 'profiles']);
  });
});
