import { describe, expect, it } from 'vitest';
import { simulateChoiceData } from '../../../server/engine/estimation/simulate-choice-data';
import { fitHb } from '../../../server/engine/hb/fit-hb';

const { data } = simulateChoiceData({
  respondents: 40,
  tasks: 6,
  alternatives: 3,
  seed: 8,
  coefficients: [
    { name: 'river', distribution: 'normal', location: 0.7, spread: 0.5 },
    { name: 'bill', distribution: 'normal', location: -0.4, spread: 0.3 },
  ],
});
const options = {
  coefficients: [
    { name: 'river', distribution: 'normal' },
    { name: 'bill', distribution: 'fixed' },
  ],
  iterations: 400,
  burnin: 200,
  thin: 2,
  chains: 2,
  seed: 9,
};

describe('fitHb in worker threads', () => {
  it('gives the same draws in parallel worker threads as one after another (each chain its own seed stream)', async () => {
    const inProcess = await fitHb(data, { ...options, threads: 1 });
    const workers = await fitHb(data, { ...options, threads: 2 });
    expect(workers.individuals).toEqual(inProcess.individuals);
    expect(workers.diagnostics).toEqual(inProcess.diagnostics);
    expect(workers.population.coefficients[1].location.mean).toBe(
      inProcess.population.coefficients[1].location.mean,
    );
    // Different seeds give different chains.
    const other = await fitHb(data, { ...options, seed: 10 });
    expect(other.individuals[0].mean.river).not.toBe(inProcess.individuals[0].mean.river);
  }, 120_000);

  it('stops when the signal fires', async () => {
    const abort = new AbortController();
    abort.abort();
    await expect(
      fitHb(data, { ...options, iterations: 4000 }, { signal: abort.signal }),
    ).rejects.toThrow(/cancelled/);
  });
});
