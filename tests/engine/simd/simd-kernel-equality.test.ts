import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { createArenaKernel } from '../../../server/engine/simd/arena-kernel';
import { createKernelArena } from '../../../server/engine/simd/kernel-arena';
import { createRandomChoiceProblem } from './random-choice-problem';

// Both kernels compute the same sums in different orders (two SIMD lanes, blocks of draws)
// with their own ln (Math.log vs an atanh series accurate to a few ulp), so they may differ
// by rounding only: a reordered sum of m terms differs by at most about m·ε·Σ|terms|
// (Higham 2002, Accuracy and Stability of Numerical Algorithms, §4.2). With m ≤ a few
// thousand terms that stays far below 1e-10 of the sum of absolute terms, the bar.
const REL = 1e-10;

function evaluateBoth(seed: number, size: Parameters<typeof createRandomChoiceProblem>[1]) {
  const { data, layout, theta, draws } = createRandomChoiceProblem(seed, size);
  const N = data.taskStart.length - 1;
  const arena = createKernelArena(data, layout, draws.count, [
    { first: 0, count: N, variateRespondents: N },
  ]);
  const make = (kind: 'simd' | 'typescript') =>
    createArenaKernel({
      memory: arena.memory!,
      plan: arena.plan,
      sliceIndex: 0,
      columns: data.columns,
      layout,
      draws,
      kind,
      fillDraws: true,
    });
  const ts = make('typescript');
  const simd = make('simd');
  expect(simd.kind).toBe('simd');
  const P = layout.P;
  const run = (k: typeof ts) => {
    const grad = new Float64Array(P);
    const scores = new Float64Array(N * P);
    const ll = k.kernel.evaluate(theta, grad, scores);
    return { ll, grad, scores };
  };
  return { N, P, R: draws.count, K: layout.K, theta, ts, simd, a: run(ts), b: run(simd) };
}

describe('WebAssembly SIMD kernel equals the TypeScript reference kernel', () => {
  it('in LL, gradient and per-respondent scores on random problems (all distributions, correlation)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 1_000_000 }),
        fc.integer({ min: 1, max: 12 }),
        fc.integer({ min: 1, max: 12 }),
        fc.integer({ min: 1, max: 7 }),
        fc.integer({ min: 1, max: 70 }),
        (seed, respondents, maxTasks, K, draws) => {
          const { N, P, a, b } = evaluateBoth(seed, { respondents, maxTasks, K, draws });
          expect(Math.abs(b.ll - a.ll)).toBeLessThanOrEqual(REL * Math.abs(a.ll));
          for (let p = 0; p < P; p++) {
            let scale = 0;
            for (let n = 0; n < N; n++) scale += Math.abs(a.scores[n * P + p]);
            expect(Math.abs(b.grad[p] - a.grad[p])).toBeLessThanOrEqual(REL * scale);
          }
          for (let n = 0; n < N; n++) {
            const row = a.scores.subarray(n * P, (n + 1) * P);
            const scale = Math.max(...row.map(Math.abs));
            for (let p = 0; p < P; p++)
              expect(Math.abs(b.scores[n * P + p] - row[p])).toBeLessThanOrEqual(REL * scale);
          }
        },
      ),
      { numRuns: 60, seed: 17 },
    );
  });

  it('in each respondent’s draws of β and normalised weights (the taste-profile input)', () => {
    const { N, R, K, theta, ts, simd } = evaluateBoth(5, {
      respondents: 6,
      maxTasks: 9,
      K: 5,
      draws: 37,
    });
    const betas = [new Float64Array(K * R), new Float64Array(K * R)];
    const weights = [new Float64Array(R), new Float64Array(R)];
    for (let n = 0; n < N; n++) {
      const l0 = ts.kernel.simulateRespondent(n, theta, betas[0], weights[0]);
      const l1 = simd.kernel.simulateRespondent(n, theta, betas[1], weights[1]);
      expect(Math.abs(l1 - l0)).toBeLessThanOrEqual(REL * Math.abs(l0));
      betas[0].forEach((v, i) =>
        expect(Math.abs(betas[1][i] - v)).toBeLessThanOrEqual(REL * Math.abs(v)),
      );
      weights[0].forEach((v, r) =>
        expect(Math.abs(weights[1][r] - v)).toBeLessThanOrEqual(REL * v),
      );
    }
  });
});
