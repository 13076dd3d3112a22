/**
 * Log-likelihood evaluator on worker threads (piscina). Respondents are split into
 * contiguous slices of about equal work (number of alternative rows); each slice lives on
 * its own single-thread pool. The data sit once in a kernel arena (shared memory) that every
 * thread reads in place; each thread generates its slice's draws into the arena and runs the
 * chosen kernel (WebAssembly SIMD or TypeScript) on it. Per evaluation a thread gets θ and
 * returns its partial LL and gradient, summed here. Worker files are TypeScript (see ts-worker-pool.ts).
 */
import { fileURLToPath } from 'node:url';
import type { DrawsSpec } from '../draws/uniform-draws';
import type { ChoiceData } from '../estimation/choice-data';
import type { MixedLogitLayout } from '../estimation/mixed-logit-layout';
import { createKernelArena } from '../simd/kernel-arena';
import type { KernelChoice } from '../simd/kernel-choice';
import type { MixedLogitEvaluator } from './mixed-logit-evaluator';
import { createTsWorkerPool } from './ts-worker-pool';
import { getSliceSetup, type InitSliceResult, type SliceResult } from './worker-messages';

const WORKER_FILE = fileURLToPath(new URL('./mixed-logit-worker.ts', import.meta.url));

let keyCounter = 0;

/** Splits respondents into `parts` contiguous slices with about equal numbers of diff rows. */
export function splitRespondents(
  data: ChoiceData,
  parts: number,
): { first: number; count: number }[] {
  const N = data.taskStart.length - 1;
  const total = data.diffStart[data.diffStart.length - 1];
  const slices: { first: number; count: number }[] = [];
  let first = 0;
  for (let p = 1; p <= parts && first < N; p++) {
    let end = first + 1;
    const target = (total * p) / parts;
    while (end < N && (p === parts || data.diffStart[data.taskStart[end]] < target)) end++;
    slices.push({ first, count: end - first });
    first = end;
  }
  return slices;
}

/** One single-thread pool running the mixed-logit worker. */
export function createSlicePool() {
  return createTsWorkerPool(WORKER_FILE, 'handleSliceMessage', 1);
}

/** Starts `threads` worker threads holding the data and draws; remember to close() it. */
export async function createWorkerPoolEvaluator(
  data: ChoiceData,
  layout: MixedLogitLayout,
  draws: Omit<DrawsSpec, 'dimensions'>,
  threads: number,
  choice: KernelChoice,
): Promise<MixedLogitEvaluator> {
  const slices = splitRespondents(data, threads);
  const arena = createKernelArena(
    data,
    layout,
    draws.count,
    slices.map((s) => ({ ...s, variateRespondents: s.count })),
  );
  const key = `slice-${process.pid}-${++keyCounter}`;
  const pools = slices.map(() => createSlicePool());
  let inits: InitSliceResult[];
  try {
    inits = await Promise.all(
      pools.map(
        (pool, i) =>
          pool.run({
            kind: 'init',
            key,
            ...getSliceSetup(arena, i, data.columns, layout),
            draws,
            kernel: choice.kind,
          }) as Promise<InitSliceResult>,
      ),
    );
  } catch (err) {
    await Promise.all(pools.map((pool) => pool.destroy()));
    throw err;
  }
  const notes = [choice.note, ...inits.map((r) => r.note)].filter((n): n is string => !!n);
  const P = layout.P;
  const N = data.taskStart.length - 1;
  const runAll = (kind: 'evaluate' | 'scores', theta: Float64Array): Promise<SliceResult[]> =>
    Promise.all(pools.map((pool) => pool.run({ kind, key, theta }) as Promise<SliceResult>));
  return {
    parameterCount: P,
    respondentCount: N,
    kernel: inits.every((r) => r.kernel === 'simd') ? 'simd' : 'typescript',
    notes: [...new Set(notes)],
    memoryBytes: arena.plan.bytes,
    async evaluate(theta, grad) {
      const results = await runAll('evaluate', theta);
      grad.fill(0, 0, P);
      let ll = 0;
      for (const r of results) {
        ll += r[0];
        for (let p = 0; p < P; p++) grad[p] += r[1 + p];
      }
      return ll;
    },
    async evaluateScores(theta) {
      const results = await runAll('scores', theta);
      const scores = new Float64Array(N * P);
      results.forEach((r, i) => scores.set(r.subarray(1 + P), slices[i].first * P));
      return scores;
    },
    async close() {
      await Promise.all(pools.map((pool) => pool.destroy()));
    },
  };
}
