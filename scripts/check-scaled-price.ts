/**
 * The scaled-price check: a panel mixed logit whose price column is in units of 10^4 (as with
 * yen, won or house prices) is fitted as it is and, as the reference optimum, with the price
 * column divided by 10^4 (the same model, well scaled); the reference estimates are mapped back
 * to the user's units. Prints the convergence verdict, the gradient norm, both log-likelihoods
 * and the relative error of the price coefficient's population mean.
 * Usage: npx tsx scripts/check-scaled-price.ts [--json]
 */
import os from 'node:os';
import { buildChoiceData } from '../server/engine/estimation/build-choice-data';
import { fitMixedLogit } from '../server/engine/estimation/fit-mixed-logit';
import { getPopulationMoments } from '../server/engine/estimation/population-moments';
import {
  simulatePanelChoices,
  type TrueCoefficient,
} from '../server/engine/estimation/simulate-panel-choices';
import {
  fixedComfort,
  fixedPrice,
  negLognormalPrice,
  normalQuality,
} from '../server/engine/estimation/simulate-choice-data';

const SCALE = Number(process.argv.find((a) => a.startsWith('--scale='))?.slice(8) ?? 1e4);
const PRICE = (process.argv.find((a) => a.startsWith('--price='))?.slice(8) ?? 'fixed') as
  'fixed' | 'neg_lognormal';
const truth: TrueCoefficient[] = [
  normalQuality,
  fixedComfort,
  PRICE === 'fixed' ? fixedPrice(-0.8) : negLognormalPrice(0.6),
];
const coefficients = truth.map(({ name, distribution }) => ({ name, distribution }));

async function main(): Promise<void> {
  const sim = simulatePanelChoices({
    respondents: 400,
    tasks: 8,
    alternatives: 3,
    coefficients: truth,
    seed: 2024,
  });
  const priceColumn = sim.columns.indexOf('price');
  const scaledRows = sim.rows.map((r) => ({
    ...r,
    values: Array.from(r.values, (v, k) => (k === priceColumn ? v * SCALE : v)),
  }));
  const options = { coefficients, draws: { count: 200, seed: 1 } };
  const reference = await fitMixedLogit(buildChoiceData(sim.columns, sim.rows).data, options);
  const started = performance.now();
  const scaled = await fitMixedLogit(buildChoiceData(sim.columns, scaledRows).data, options);
  const seconds = (performance.now() - started) / 1000;
  const priceMean = (fit: typeof scaled) =>
    getPopulationMoments(fit.layout, fit.estimates).find((m) => m.name === 'price')!.mean;
  const referencePrice = priceMean(reference) / SCALE;
  const out = {
    check: 'scaled-price',
    converged: scaled.converged,
    status: scaled.status,
    gradientNorm: scaled.gradientNorm,
    maxRelativeGradient: scaled.measures.maxRelativeGradient,
    loglik: scaled.loglik,
    loglikOptimum: reference.loglik,
    priceMean: priceMean(scaled),
    priceMeanOptimum: referencePrice,
    priceRelativeError: Math.abs(priceMean(scaled) / referencePrice - 1),
    iterations: scaled.iterations,
    seconds,
    loadavg: os.loadavg(),
  };
  if (process.argv.includes('--json')) process.stdout.write(`${JSON.stringify(out)}\n`);
  else for (const [k, v] of Object.entries(out)) process.stdout.write(`${k}: ${String(v)}\n`);
}

void main();
