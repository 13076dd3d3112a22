/**
 * Benchmark of the mixed-logit estimation engine on seeded synthetic data:
 * N = 1000 respondents, T = 12 tasks, J = 3 alternatives, K = 6 normal coefficients,
 * R = 500 scrambled Halton draws. Prints ms per LL+gradient evaluation on the main thread and
 * on 1 and 2 worker threads, and the BFGS iterations, evaluations and wall time of a full estimation.
 * Usage: npm run bench:estimation [-- --json] [-- --threads 2]
 */
import { buildChoiceData } from '../server/engine/estimation/build-choice-data';
import { fitMixedLogit } from '../server/engine/estimation/fit-mixed-logit';
import {
  createMixedLogitLayout,
  type CoefficientSpec,
} from '../server/engine/estimation/mixed-logit-layout';
import { simulatePanelChoices } from '../server/engine/estimation/simulate-panel-choices';
import { computeTasteProfiles } from '../server/engine/estimation/taste-profiles';
import { createLoglikEvaluator } from '../server/engine/parallel/create-loglik-evaluator';
import { createWorkerPoolEvaluator } from '../server/engine/parallel/worker-pool-evaluator';

const json = process.argv.includes('--json');
const threadsArg = process.argv.indexOf('--threads');
const fitThreads = threadsArg > 0 ? Number(process.argv[threadsArg + 1]) : 2;

const N = 1000;
const T = 12;
const J = 3;
const K = 6;
const R = 500;
const truth = Array.from({ length: K }, (_, k) => ({
  name: `x${k + 1}`,
  distribution: 'normal' as const,
  location: k % 2 === 0 ? 0.6 + 0.1 * k : -0.5 - 0.1 * k,
  spread: 0.4 + 0.05 * k,
}));
const coefficients: CoefficientSpec[] = truth.map((c) => ({
  name: c.name,
  distribution: c.distribution,
}));
const draws = { type: 'halton' as const, count: R, seed: 1, scrambled: true };

/** threads = 0: in-process kernel on the main thread; otherwise that many worker threads. */
async function timeEvaluations(
  threads: number,
  repeats: number,
): Promise<{ ms: number; setupMs: number }> {
  const setupStart = performance.now();
  const evaluator =
    threads === 0
      ? await createLoglikEvaluator(data, layout, draws, 1)
      : await createWorkerPoolEvaluator(data, layout, draws, threads);
  const setupMs = performance.now() - setupStart;
  const theta = new Float64Array(layout.P);
  truth.forEach((c, k) => {
    theta[k] = c.location;
    theta[K + k] = c.spread;
  });
  const grad = new Float64Array(layout.P);
  await evaluator.evaluate(theta, grad); // warm-up (JIT)
  await evaluator.evaluate(theta, grad);
  const start = performance.now();
  for (let i = 0; i < repeats; i++) await evaluator.evaluate(theta, grad);
  const ms = (performance.now() - start) / repeats;
  await evaluator.close();
  return { ms, setupMs };
}

const sim = simulatePanelChoices({
  respondents: N,
  tasks: T,
  alternatives: J,
  coefficients: truth,
  seed: 2024,
});
const { data } = buildChoiceData(sim.columns, sim.rows);
const layout = createMixedLogitLayout(data, coefficients, false);

const inProcess = await timeEvaluations(0, 10);
const one = await timeEvaluations(1, 10);
const two = await timeEvaluations(2, 10);
const fitStart = performance.now();
// One start, so the figures stay comparable with those measured before starts defaulted to 3.
const fit = await fitMixedLogit(data, { coefficients, draws, threads: fitThreads, starts: 1 });
const totalSeconds = (performance.now() - fitStart) / 1000;
const profilesStart = performance.now();
computeTasteProfiles(data, fit.layout, fit.estimates, { count: 2000 });
const profilesSeconds = (performance.now() - profilesStart) / 1000;

const figures = {
  respondents: N,
  tasks: T,
  alternatives: J,
  coefficients: K,
  draws: R,
  evalMsInProcess: Number(inProcess.ms.toFixed(1)),
  evalMs1: Number(one.ms.toFixed(1)),
  evalMs2: Number(two.ms.toFixed(1)),
  setupMs2: Number(two.setupMs.toFixed(0)),
  iterations: fit.iterations,
  evaluations: fit.evaluations,
  converged: fit.converged,
  stopReason: fit.status,
  loglik: Number(fit.loglik.toFixed(4)),
  fitThreads,
  totalSeconds: Number(totalSeconds.toFixed(2)),
  profilesSeconds: Number(profilesSeconds.toFixed(2)),
};
if (json) {
  console.log(JSON.stringify(figures));
} else {
  console.log(
    `Mixed logit benchmark: N=${N}, T=${T}, J=${J}, K=${K} normal, R=${R} scrambled Halton`,
  );
  console.log(`  LL+gradient evaluation, main thread (no workers): ${figures.evalMsInProcess} ms`);
  console.log(`  LL+gradient evaluation, 1 worker thread: ${figures.evalMs1} ms`);
  console.log(
    `  LL+gradient evaluation, 2 worker threads: ${figures.evalMs2} ms (pool start ${figures.setupMs2} ms)`,
  );
  console.log(
    `  full estimation on ${fitThreads} thread(s): ${figures.iterations} BFGS iterations, ${figures.evaluations} evaluations (incl. Hessian), ${figures.totalSeconds} s`,
  );
  console.log(`  converged: ${figures.converged} (${figures.stopReason}), LL = ${figures.loglik}`);
  console.log(
    `  taste profiles (2000 draws per respondent, main thread): ${figures.profilesSeconds} s`,
  );
}
