/**
 * Benchmark of the mixed-logit estimation engine on seeded synthetic data, both kernels side
 * by side in the same run: N = 1000 respondents, T = 12 tasks, J = 3 alternatives, K = 6
 * normal coefficients, R = 500 scrambled Halton draws. Prints ms per LL+gradient evaluation
 * of the TypeScript and the WebAssembly SIMD kernel on the main thread and on 1 and 2 worker
 * threads (rounds interleaved, median of the rounds, so a change in the machine's load hits
 * both kernels alike), then a full estimation with each kernel, the taste profiles, the peak
 * resident memory and the load average (os.loadavg) at start and end. Then both first inverse
 * Hessians of BFGS side by side (`startComparison`): the scaled identity and the inverse BHHH
 * matrix (bhhh-start.ts) on N = 1000, T = 12, J = 3, K = 6 correlated normals (27 parameters),
 * R = 200, three starts, BHHH standard errors: iterations, evaluations and seconds of each.
 * With --large: the large-model benchmark instead (bench-estimation-large.ts).
 * Usage: npm run bench:estimation [-- --json] [-- --threads 2] [-- --large]
 */
import os from 'node:os';
import { fitMixedLogit } from '../server/engine/estimation/fit-mixed-logit';
import { createMixedLogitLayout } from '../server/engine/estimation/mixed-logit-layout';
import {
  alternatingNormals,
  simulateChoiceData,
} from '../server/engine/estimation/simulate-choice-data';
import { computeTasteProfiles } from '../server/engine/estimation/taste-profiles';
import { createLoglikEvaluator } from '../server/engine/parallel/create-loglik-evaluator';
import type { MixedLogitEvaluator } from '../server/engine/parallel/mixed-logit-evaluator';
import { createWorkerPoolEvaluator } from '../server/engine/parallel/worker-pool-evaluator';
import { chooseKernel, type KernelKind } from '../server/engine/simd/kernel-choice';
import { ensureEngineBuilt } from './lib/ensure-engine-built';
import { readBenchCli } from './lib/bench-cli';

const cli = readBenchCli();
const json = cli.asJson;
if (cli.has('large')) {
  await import('./bench-estimation-large');
  process.exit(0);
}
const fitThreads = cli.number('threads', 2);
const loadStart = os.loadavg();
await ensureEngineBuilt();

const N = 1000;
const T = 12;
const J = 3;
const K = 6;
const R = 500;
const ROUNDS = 3;
const REPEATS = 5;
const truth = alternatingNormals(K, {
  even: 0.6,
  odd: -0.5,
  step: 0.1,
  spread: 0.4,
  spreadStep: 0.05,
});
const draws = { type: 'halton' as const, count: R, seed: 1, scrambled: true };
const { data, coefficients } = simulateChoiceData({
  respondents: N,
  tasks: T,
  alternatives: J,
  coefficients: truth,
  seed: 2024,
});
const layout = createMixedLogitLayout(data, coefficients, false);
const theta = new Float64Array(layout.P);
truth.forEach((c, k) => {
  theta[k] = c.location;
  theta[K + k] = c.spread;
});

/** threads = 0: in-process kernel on the main thread; otherwise that many worker threads. */
async function createEvaluator(kind: KernelKind, threads: number): Promise<MixedLogitEvaluator> {
  const evaluator =
    threads === 0
      ? await createLoglikEvaluator(data, layout, draws, 1, kind)
      : await createWorkerPoolEvaluator(data, layout, draws, threads, chooseKernel(kind));
  if (evaluator.kernel !== kind) throw new Error(`${kind} kernel unavailable: ${evaluator.notes}`);
  const grad = new Float64Array(layout.P);
  await evaluator.evaluate(theta, grad); // warm-up (JIT, tier-up of the WebAssembly code)
  await evaluator.evaluate(theta, grad);
  return evaluator;
}

async function timeEvaluations(evaluator: MixedLogitEvaluator): Promise<number> {
  const grad = new Float64Array(layout.P);
  const start = performance.now();
  for (let i = 0; i < REPEATS; i++) await evaluator.evaluate(theta, grad);
  return (performance.now() - start) / REPEATS;
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const configs = (['typescript', 'simd'] as const).flatMap((kind) =>
  [0, 1, 2].map((threads) => ({ kind, threads })),
);
const evaluators = [];
for (const c of configs) evaluators.push(await createEvaluator(c.kind, c.threads));
const times = configs.map(() => [] as number[]);
for (let round = 0; round < ROUNDS; round++)
  for (let i = 0; i < configs.length; i++) times[i].push(await timeEvaluations(evaluators[i]));
for (const e of evaluators) await e.close();
const ms = (kind: KernelKind, threads: number) =>
  Number(
    median(times[configs.findIndex((c) => c.kind === kind && c.threads === threads)]).toFixed(1),
  );

async function timeFit(kernel: KernelKind) {
  const start = performance.now();
  // One start, so the figures stay comparable with those measured before starts defaulted to 3.
  const fit = await fitMixedLogit(data, {
    coefficients,
    draws,
    threads: fitThreads,
    kernel,
    starts: 1,
  });
  return { fit, seconds: (performance.now() - start) / 1000 };
}
const simdFit = await timeFit('simd');
const tsFit = await timeFit('typescript');
/** The largest absolute difference between two fits' estimates. */
const maxDifference = (a: ArrayLike<number>, b: ArrayLike<number>) =>
  Array.from(a, (v, p) => Math.abs(v - b[p])).reduce((m, d) => Math.max(m, d), 0);
const maxEstimateDifference = maxDifference(simdFit.fit.estimates, tsFit.fit.estimates);
async function compareStarts() {
  const correlated = simulateChoiceData({
    respondents: N,
    tasks: T,
    alternatives: J,
    coefficients: truth,
    seed: 5,
  }).data;
  const run = async (initialInverseHessian: 'identity' | 'bhhh') => {
    const start = performance.now();
    const fit = await fitMixedLogit(correlated, {
      coefficients,
      correlated: true,
      draws: { ...draws, count: 200 },
      threads: fitThreads,
      covariance: 'bhhh',
      initialInverseHessian,
    });
    const seconds = (performance.now() - start) / 1000;
    return { fit, seconds };
  };
  const runs = { identity: await run('identity'), bhhh: await run('bhhh') };
  const summary = ({ fit, seconds }: (typeof runs)['bhhh']) => ({
    iterations: fit.iterations,
    iterationsPerStart: fit.starts.map((s) => s.iterations),
    evaluations: fit.evaluations,
    seconds: Number(seconds.toFixed(2)),
    loglik: Number(fit.loglik.toFixed(4)),
    converged: fit.converged,
  });
  const maxEstimateDifference = maxDifference(runs.bhhh.fit.estimates, runs.identity.fit.estimates);
  return {
    parameters: runs.bhhh.fit.layout.P,
    draws: 200,
    identity: summary(runs.identity),
    bhhh: summary(runs.bhhh),
    maxEstimateDifference: Number(maxEstimateDifference.toExponential(2)),
  };
}
const startComparison = await compareStarts();
const profilesStart = performance.now();
computeTasteProfiles(data, simdFit.fit.layout, simdFit.fit.estimates, { count: 2000 });
const profilesSeconds = (performance.now() - profilesStart) / 1000;
const round2 = (x: number) => Number(x.toFixed(2));

const figures = {
  respondents: N,
  tasks: T,
  alternatives: J,
  coefficients: K,
  draws: R,
  evalMsInProcess: ms('typescript', 0),
  evalMs1: ms('typescript', 1),
  evalMs2: ms('typescript', 2),
  evalMsInProcessSimd: ms('simd', 0),
  evalMs1Simd: ms('simd', 1),
  evalMs2Simd: ms('simd', 2),
  speedup: round2(ms('typescript', 2) / ms('simd', 2)),
  iterations: simdFit.fit.iterations,
  evaluations: simdFit.fit.evaluations,
  converged: simdFit.fit.converged,
  stopReason: simdFit.fit.status,
  loglik: Number(simdFit.fit.loglik.toFixed(4)),
  fitThreads,
  totalSeconds: round2(simdFit.seconds),
  totalSecondsTypescript: round2(tsFit.seconds),
  iterationsTypescript: tsFit.fit.iterations,
  maxEstimateDifference: Number(maxEstimateDifference.toExponential(2)),
  profilesSeconds: round2(profilesSeconds),
  startComparison,
  peakRssMb: Math.round(process.resourceUsage().maxRSS / 1024),
  loadAverageStart: loadStart.map(round2),
  loadAverageEnd: os.loadavg().map(round2),
};
if (json) {
  console.log(JSON.stringify(figures));
} else {
  const f = figures;
  console.log(
    `Mixed logit benchmark: N=${N}, T=${T}, J=${J}, K=${K} normal, R=${R} scrambled Halton`,
  );
  console.log(`  ms per LL+gradient     TypeScript   WebAssembly SIMD`);
  console.log(`  main thread            ${f.evalMsInProcess}   ${f.evalMsInProcessSimd}`);
  console.log(`  1 worker thread        ${f.evalMs1}   ${f.evalMs1Simd}`);
  console.log(
    `  2 worker threads       ${f.evalMs2}   ${f.evalMs2Simd}   (speed-up ${f.speedup}×)`,
  );
  console.log(
    `  full estimation on ${fitThreads} thread(s), SIMD: ${f.iterations} BFGS iterations, ${f.evaluations} evaluations (incl. Hessian), ${f.totalSeconds} s; TypeScript: ${f.iterationsTypescript} iterations, ${f.totalSecondsTypescript} s`,
  );
  console.log(
    `  converged: ${f.converged} (${f.stopReason}), LL = ${f.loglik}; largest estimate difference between kernels ${f.maxEstimateDifference}`,
  );
  const c = f.startComparison;
  console.log(
    `  K=6 correlated (${c.parameters} parameters), R=${c.draws}, 3 starts: BFGS from the scaled identity ${c.identity.iterations} iterations (${c.identity.iterationsPerStart.join('+')}), ${c.identity.evaluations} evaluations, ${c.identity.seconds} s; from the inverse BHHH matrix ${c.bhhh.iterations} iterations (${c.bhhh.iterationsPerStart.join('+')}), ${c.bhhh.evaluations} evaluations, ${c.bhhh.seconds} s; LL ${c.identity.loglik} / ${c.bhhh.loglik}, largest estimate difference ${c.maxEstimateDifference}`,
  );
  console.log(`  taste profiles (2000 draws per respondent): ${f.profilesSeconds} s`);
  console.log(
    `  peak RSS ${f.peakRssMb} MB; load average ${f.loadAverageStart} → ${f.loadAverageEnd}`,
  );
}
