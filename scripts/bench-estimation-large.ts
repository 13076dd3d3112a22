/**
 * Large-model benchmark (npm run bench:estimation -- --large [--json]): N = 5000 respondents,
 * T = 16 tasks, J = 3 alternatives, K = 12 correlated normal coefficients (12 means and the
 * 78 elements of the Cholesky factor: 90 parameters), R = 1000 scrambled Halton draws, on 2
 * worker threads with the default kernel (WebAssembly SIMD when it can run). Times the full
 * estimation with BHHH standard errors, then the taste profiles (2000 draws each), and prints
 * the peak resident memory (whole process, worker threads included), the engine's own memory
 * estimate and the load average (os.loadavg) at start and end. Targets: < 10 min, < 2 GB.
 * BFGS starts from the inverse BHHH matrix (the default); `--identity-start` times the scaled
 * identity start instead, for a before/after comparison of the iteration count.
 */
import os from 'node:os';
import { fitMixedLogit } from '../server/engine/estimation/fit-mixed-logit';
import {
  alternatingNormals,
  simulateChoiceData,
} from '../server/engine/estimation/simulate-choice-data';
import { computeTasteProfilesInWorkers } from '../server/engine/parallel/parallel-taste-profiles';
import { getMaxRespondentRows } from '../server/engine/estimation/choice-data';
import { estimateModelMemory } from '../server/engine/simd/estimate-model-memory';
import { getArenaDimensions } from '../server/engine/simd/kernel-arena';
import { ensureEngineBuilt } from './lib/ensure-engine-built';
import { readBenchCli } from './lib/bench-cli';

const cli = readBenchCli();
const { log } = cli;
const json = cli.asJson;
const loadStart = os.loadavg();
await ensureEngineBuilt();
const N = 5000;
const T = 16;
const J = 3;
const K = 12;
const R = 1000;
const PROFILE_DRAWS = 2000;
const THREADS = 2;
const initialInverseHessian = cli.has('identity-start') ? 'identity' : 'bhhh';
const { data, coefficients } = simulateChoiceData({
  respondents: N,
  tasks: T,
  alternatives: J,
  coefficients: alternatingNormals(K, {
    even: 0.5,
    odd: -0.4,
    step: 0.05,
    spread: 0.3,
    spreadStep: 0.03,
  }),
  seed: 5,
});
const started = performance.now();
let lastIteration = 0;
const fit = await fitMixedLogit(
  data,
  {
    coefficients,
    correlated: true,
    draws: { count: R },
    threads: THREADS,
    covariance: 'bhhh',
    profileDraws: PROFILE_DRAWS,
    initialInverseHessian,
  },
  {
    onProgress: (p) => {
      lastIteration = p.iteration;
      if (p.iteration % 10 === 0)
        log(
          `  iteration ${p.iteration}: LL ${p.loglik.toFixed(2)}, |g| ${p.gradientNorm.toExponential(2)}, about ${Math.round(p.secondsLeft)} s left (load ${os.loadavg()[0].toFixed(1)})`,
        );
    },
    onNote: (note) => log(`  note: ${note}`),
  },
);
const fitSeconds = (performance.now() - started) / 1000;
const profilesStart = performance.now();
await computeTasteProfilesInWorkers(data, fit.layout, fit.estimates, {
  count: PROFILE_DRAWS,
  threads: THREADS,
});
const profilesSeconds = (performance.now() - profilesStart) / 1000;
const layout = fit.layout;
const memoryEstimate = estimateModelMemory({
  ...getArenaDimensions(data, layout, R),
  profileDraws: PROFILE_DRAWS,
  maxRows: getMaxRespondentRows(data, 0, N),
  threads: THREADS,
});
const round2 = (x: number) => Number(x.toFixed(2));
const figures = {
  respondents: N,
  tasks: T,
  alternatives: J,
  coefficients: K,
  parameters: layout.P,
  draws: R,
  threads: THREADS,
  kernel: fit.kernel,
  initialInverseHessian,
  iterationsPerStart: fit.starts.map((s) => s.iterations),
  iterations: fit.iterations || lastIteration,
  evaluations: fit.evaluations,
  secondsPerEvaluation: round2(fitSeconds / fit.evaluations),
  converged: fit.converged,
  stopReason: fit.status,
  loglik: round2(fit.loglik),
  standardErrors: 'bhhh',
  totalSeconds: round2(fitSeconds),
  profilesSeconds: round2(profilesSeconds),
  allSeconds: round2(fitSeconds + profilesSeconds),
  peakRssMb: Math.round(process.resourceUsage().maxRSS / 1024),
  memoryEstimateMb: Math.round(memoryEstimate / 2 ** 20),
  targets: { totalSeconds: 600, peakRssMb: 2048 },
  loadAverageStart: loadStart.map(round2),
  loadAverageEnd: os.loadavg().map(round2),
};
if (json) console.log(JSON.stringify(figures));
else console.log(figures);
