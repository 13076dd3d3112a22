/**
 * The estimation thread passes every kind of progress across its port, including the stages
 * after the optimisation, so the run's progress names them while the thread works; and it
 * holds a mixed logit while the web process's fieldwork flag is busy (fieldwork-yield.ts).
 */
import { afterAll, describe, expect, it } from 'vitest';
import { estimationSpecSchema } from '../../../shared/schemas/estimation-spec';
import { simulateChoiceData } from '../../../server/engine/estimation/simulate-choice-data';
import { holdBusy } from '../../support/hold-busy';
import {
  createEstimationPool,
  runEstimationInWorker,
} from '../../../server/engine/parallel/run-estimation-in-worker';

const pool = createEstimationPool();
afterAll(() => pool.destroy());

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
describe('estimation thread', () => {
  it('reports iterations, then standard errors, WTP and taste profiles', async () => {
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

  it('waits while fieldwork is busy, then fits the same model', async () => {
    const plain = await runEstimationInWorker(pool, { spec, built, threads: 1 });
    const { fieldworkBusy, calmAt } = holdBusy(300);
    const notes: string[] = [];
    let firstProgressAt = 0;
    const held = await runEstimationInWorker(
      pool,
      { spec, built, threads: 1, fieldworkBusy },
      {
        onNote: (note) => notes.push(note),
        onProgress: () => {
          firstProgressAt ||= performance.now();
        },
      },
    );
    // No iteration before the flag turned calm, and the log says why the run waited.
    expect(firstProgressAt).toBeGreaterThanOrEqual(await calmAt);
    expect(notes[0]).toBe('waiting while respondents keep the web process busy');
    const waited = Number(/waited ([\d.]+) s in all for fieldwork/.exec(notes.at(-1) ?? '')?.[1]);
    expect(waited).toBeGreaterThan(0);
    // Waiting changes no number of the fit.
    expect(held.estimates).toEqual(plain.estimates);
    expect(held.loglik).toBe(plain.loglik);
    expect(held.individuals).toEqual(plain.individuals);
  });

  const hb = estimationSpecSchema.parse({
    model: 'hb',
    coefficients: spec.coefficients,
    mcmc: { iterations: 200, burnin: 100, thin: 2, chains: 2, seed: 3 },
  });
  const latentClass = estimationSpecSchema.parse({
    model: 'latent_class',
    coefficients: spec.coefficients.map((c) => ({ name: c.name })),
    classes: [2, 2],
    starts: 2,
    seed: 4,
  });
  // HB chains wait at their progress reports, latent class between EM iterations; with one
  // thread in the engine thread, with two on threads of their own.
  it.each([
    ['hierarchical Bayes', hb, 1],
    ['hierarchical Bayes', hb, 2],
    ['latent class', latentClass, 1],
    ['latent class', latentClass, 2],
  ] as const)(
    'holds a %s fit (%i thread(s)) while fieldwork is busy',
    async (_, model, threads) => {
      const started = performance.now();
      const plain = await runEstimationInWorker(pool, { spec: model, built, threads });
      // Held longer than the whole run takes unheld: finishing before the flag turns calm
      // would mean the fit never waited.
      const { fieldworkBusy, calmAt } = holdBusy(Math.max(300, 2 * (performance.now() - started)));
      const held = await runEstimationInWorker(pool, {
        spec: model,
        built,
        threads,
        fieldworkBusy,
      });
      expect(performance.now()).toBeGreaterThanOrEqual(await calmAt);
      // Waiting changes no draw and no EM step.
      expect(held.estimates).toEqual(plain.estimates);
      expect(held.individuals).toEqual(plain.individuals);
    },
  );
});
