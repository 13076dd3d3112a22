import { describe, expect, it } from 'vitest';
import { computeTasteProfiles } from '../../../server/engine/estimation/taste-profiles';
import { computeTasteProfilesInWorkers } from '../../../server/engine/parallel/parallel-taste-profiles';
import { createKernelFixture } from '../estimation/kernel-fixture';

// Same sums in another order (see simd-kernel-equality.test.ts): rounding-level agreement.
const REL = 1e-10;
const close = (a: number, b: number) =>
  expect(Math.abs(a - b)).toBeLessThanOrEqual(REL * Math.max(Math.abs(a), Math.abs(b), 1e-300));

describe('taste profiles with either kernel, in-process or on worker threads', () => {
  const { data, layout } = createKernelFixture(['normal', 'neg_lognormal', 'uniform']);
  // Spreads well away from zero: an SD of ~0 is √(Σwβ² − (Σwβ)²) of two nearly equal sums,
  // whose rounding noise (√ε·|β|) differs between any two summation orders.
  const theta = Float64Array.from([0.3, -0.5, 0.2, 0.6, 0.4, 0.5]);
  const options = { count: 150, cost: 'x2' };

  it('the SIMD kernel gives the TypeScript kernel’s means, SDs, WTP and effective draws', () => {
    const ts = computeTasteProfiles(data, layout, theta, { ...options, kernel: 'typescript' });
    const simd = computeTasteProfiles(data, layout, theta, { ...options, kernel: 'simd' });
    expect(simd.profiles).toHaveLength(25);
    simd.profiles.forEach((p, n) => {
      const q = ts.profiles[n];
      expect(p.respondent).toBe(q.respondent);
      for (const name of ['x1', 'x2', 'x3']) {
        close(p.mean[name], q.mean[name]);
        close(p.sd[name], q.sd[name]);
      }
      expect(Object.keys(p.wtp!)).toEqual(['x1', 'x3']);
      close(p.wtp!.x1, q.wtp!.x1);
      close(p.effectiveDraws, q.effectiveDraws);
    });
  });

  it('worker threads stream the same profiles as the calling thread', async () => {
    const here = computeTasteProfiles(data, layout, theta, options);
    const workers = await computeTasteProfilesInWorkers(data, layout, theta, {
      ...options,
      threads: 2,
    });
    expect(workers.profiles).toEqual(here.profiles);
    expect(workers.population).toEqual(here.population);
  });
});
