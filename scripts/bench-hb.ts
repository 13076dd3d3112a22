/**
 * Benchmark of the hierarchical Bayes sampler on the committed simulated data set
 * (scripts/bench-data/hb-choices.csv: 330 respondents × 16 tasks × 5 alternatives, one of them
 * "none", 10 correlated normal coefficients; generate-hb-bench-data.ts). Runs 20,000 iterations
 * (10,000 burn-in, thinning 10) in 2 chains on 2 worker threads with a full covariance, and
 * prints the wall time, sampler iterations per second (all chains), the largest split R-hat,
 * the smallest ESS (μ and diag Σ) and the load average. Target: < 20 s on 2 cores.
 * Usage: npm run bench:hb [-- --json] [-- --iterations N] [-- --threads N]
 */
import { readFileSync } from 'node:fs';
import os from 'node:os';
import { parseArgs } from 'node:util';
import { buildChoiceData } from '../server/engine/estimation/build-choice-data';
import { parseChoiceCsv } from '../server/engine/estimation/parse-choice-csv';
import { fitHb } from '../server/engine/hb/fit-hb';

const { values: args } = parseArgs({
  options: {
    json: { type: 'boolean' },
    iterations: { type: 'string' },
    threads: { type: 'string' },
  },
});
const iterations = Number(args.iterations ?? 20_000);
const threads = Number(args.threads ?? 2);
const truth = JSON.parse(
  readFileSync(new URL('./bench-data/hb-truth.json', import.meta.url), 'utf8'),
) as {
  names: string[];
  mu: number[];
};
const csv = readFileSync(new URL('./bench-data/hb-choices.csv', import.meta.url), 'utf8');
const { data } = buildChoiceData(truth.names, parseChoiceCsv(csv, truth.names));

const started = performance.now();
const fit = await fitHb(data, {
  coefficients: truth.names.map((name) => ({ name, distribution: 'normal' })),
  correlated: true,
  iterations,
  burnin: iterations / 2,
  thin: 10,
  chains: 2,
  seed: 1,
  threads,
});
const seconds = (performance.now() - started) / 1000;
const figures = {
  seconds: Number(seconds.toFixed(2)),
  iterationsPerSecond: Math.round((iterations * 2) / seconds),
  rhatMax: Number(fit.diagnostics.rhatMax.toFixed(4)),
  essMin: Math.round(fit.diagnostics.essMin),
  loadAverage: os.loadavg().map((x) => Number(x.toFixed(2))),
  respondents: fit.fit.respondents,
  iterations,
  chains: 2,
  threads,
  acceptance: fit.diagnostics.chains.map((c) => Number(c.acceptance.toFixed(3))),
};
if (args.json) console.log(JSON.stringify(figures));
else {
  console.log(
    `HB benchmark: ${figures.respondents} respondents, 10 correlated coefficients, ${iterations} iterations × 2 chains on ${threads} thread(s)`,
  );
  console.log(
    `  wall time ${figures.seconds} s (target < 20 s), ${figures.iterationsPerSecond} iterations/s`,
  );
  console.log(`  largest split R-hat ${figures.rhatMax}, smallest ESS ${figures.essMin}`);
  console.log(
    `  acceptance per chain ${figures.acceptance.join(', ')}; load average ${figures.loadAverage.join(' ')}`,
  );
  truth.names.forEach((name, k) => {
    const c = fit.population.coefficients[k];
    console.log(
      `  ${name}: true μ ${truth.mu[k]}, posterior ${c.location.mean.toFixed(3)} (SD ${c.location.sd.toFixed(3)})`,
    );
  });
}
