/**
 * Benchmark of the hierarchical Bayes sampler on the committed simulated data set
 * (scripts/bench-data/hb-choices.csv: 330 respondents × 16 tasks × 5 alternatives, one of them
 * "none", 10 correlated normal coefficients; generate-hb-bench-data.ts). Runs 20,000 iterations
 * (10,000 burn-in, thinning 10, one MH step per respondent per iteration) in 2 chains on 2 worker
 * threads with a full covariance, once with the current respondent layer (whole MH sweeps in the
 * WebAssembly SIMD kernel, server/engine/hb/respondent-simd-kernel.ts) and once with the previous
 * one (proposal and acceptance in TypeScript, the proposals' likelihoods in the same kernel; the
 * same chain draw for draw), same seed, one after the other in this run.
 * For each it prints the wall and CPU seconds (this process and its worker threads) of the chains
 * (MNL start + sampler) and the summary, after a 100-iteration warm-up that starts the threads, iterations per second (all chains), the largest split
 * R-hat and the smallest ESS (μ and diag Σ); and the load average before and after. The issue's
 * target: < 20 s on 2 cores. Run it once per version on a shared machine, not in a loop.
 * Usage: npm run bench:hb [-- --json] [-- --iterations N] [-- --kernel current|previous|both]
 */
import { readFileSync } from 'node:fs';
import os from 'node:os';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { buildChoiceData } from '../server/engine/estimation/build-choice-data';
import { parseChoiceCsv } from '../server/engine/estimation/parse-choice-csv';
import { checkHbOptions, type HbOptions } from '../server/engine/hb/check-hb-options';
import type { HbChainResult } from '../server/engine/hb/hb-chain-result';
import { summarizeHb } from '../server/engine/hb/summarize-hb';
import { createTsWorkerPool, shareChoiceData } from '../server/engine/parallel/ts-worker-pool';
import type { HbBenchMessage } from './lib/hb-bench-worker';
import { ensureEngineBuilt } from './lib/ensure-engine-built';

// The new kernel runs the WebAssembly step: build it first when its sources are newer.
await ensureEngineBuilt();

const { values: args } = parseArgs({
  options: {
    json: { type: 'boolean' },
    iterations: { type: 'string' },
    kernel: { type: 'string' },
  },
});
const iterations = Number(args.iterations ?? 20_000);
const kernels = (
  args.kernel === 'current' || args.kernel === 'previous' ? [args.kernel] : ['current', 'previous']
) as HbBenchMessage['kernel'][];
const truth = JSON.parse(
  readFileSync(new URL('./bench-data/hb-truth.json', import.meta.url), 'utf8'),
) as { names: string[]; mu: number[] };
const csv = readFileSync(new URL('./bench-data/hb-choices.csv', import.meta.url), 'utf8');
const { data } = buildChoiceData(truth.names, parseChoiceCsv(csv, truth.names));
const options: HbOptions = {
  coefficients: truth.names.map((name) => ({ name, distribution: 'normal' })),
  correlated: true,
  iterations,
  burnin: iterations / 2,
  thin: 10,
  // The target is for the plain sampler: one MH step per respondent per iteration.
  steps: 1,
  chains: 2,
  seed: 1,
};
const opts = checkHbOptions(data, options);
const shared = shareChoiceData(data);
const round = (x: number, digits = 2) => Number(x.toFixed(digits));
const loadBefore = os.loadavg().map((x) => round(x));

const pool = createTsWorkerPool(
  fileURLToPath(new URL('./lib/hb-bench-worker.ts', import.meta.url)),
  'runBenchChain',
  2,
);
const results: Record<string, ReturnType<typeof describeRun>> = {};
try {
  // Threads start and load their modules before the clock runs (a short run of each kernel).
  for (const kernel of kernels)
    await runChains(kernel, { ...options, iterations: 100, burnin: 50, thin: 1 });
  for (const kernel of kernels) results[kernel] = await timeKernel(kernel);
} finally {
  await pool.destroy();
}
const current = results.current ?? results.previous;
const figures = {
  seconds: current.seconds,
  cpuSeconds: current.cpuSeconds,
  iterationsPerSecond: current.iterationsPerSecond,
  rhatMax: current.rhatMax,
  essMin: current.essMin,
  loadAverage: os.loadavg().map((x) => round(x)),
  loadAverageBefore: loadBefore,
  targetSeconds: 20,
  kernel: results.current ? 'current' : 'previous',
  previous: results.current && results.previous ? results.previous : undefined,
  speedup:
    results.current && results.previous
      ? {
          wall: round(results.previous.seconds / results.current.seconds),
          cpu: round(results.previous.cpuSeconds / results.current.cpuSeconds),
        }
      : undefined,
  respondents: data.taskStart.length - 1,
  iterations,
  chains: 2,
  threads: 2,
  cpus: os.cpus().length,
};
if (args.json) console.log(JSON.stringify(figures));
else {
  console.log(
    `HB benchmark: ${figures.respondents} respondents, 10 correlated coefficients, ${iterations} iterations × 2 chains on 2 threads (${figures.cpus} CPUs)`,
  );
  for (const [kernel, r] of Object.entries(results))
    console.log(
      `  ${kernel.padEnd(8)} wall ${r.seconds} s (target < 20 s), CPU ${r.cpuSeconds} s, ${r.iterationsPerSecond} iterations/s, R-hat max ${r.rhatMax}, ESS min ${r.essMin}, acceptance ${r.acceptance.join(', ')}`,
    );
  console.log(
    `  load average before ${loadBefore.join(' ')}, after ${figures.loadAverage.join(' ')}`,
  );
}

async function timeKernel(kernel: HbBenchMessage['kernel']) {
  const started = performance.now();
  const cpu = process.cpuUsage();
  const chains = (await Promise.all(
    [0, 1].map((chain) =>
      pool.run({ kernel, data: shared, options, chain } satisfies HbBenchMessage),
    ),
  )) as HbChainResult[];
  const summary = summarizeHb(data, null, opts, chains);
  const used = process.cpuUsage(cpu);
  return describeRun(
    (performance.now() - started) / 1000,
    (used.user + used.system) / 1e6,
    summary,
    chains,
  );
}

async function runChains(kernel: HbBenchMessage['kernel'], hbOptions: HbOptions) {
  return (await Promise.all(
    [0, 1].map((chain) =>
      pool.run({ kernel, data: shared, options: hbOptions, chain } satisfies HbBenchMessage),
    ),
  )) as HbChainResult[];
}

function describeRun(
  seconds: number,
  cpuSeconds: number,
  summary: ReturnType<typeof summarizeHb>,
  chains: HbChainResult[],
) {
  return {
    seconds: round(seconds),
    cpuSeconds: round(cpuSeconds),
    iterationsPerSecond: Math.round((iterations * 2) / seconds),
    rhatMax: round(summary.diagnostics.rhatMax, 4),
    essMin: Math.round(summary.diagnostics.essMin),
    acceptance: chains.map((c) => round(c.acceptance, 3)),
    muFirst: round(summary.population.coefficients[0].location.mean, 4),
  };
}
