/**
 * Simulation noise of a mixed logit's estimates: re-estimate with three other draw seeds (from
 * the estimate, one start each) and report, per parameter, the SD of the four estimates beside
 * its standard error. Simulated maximum likelihood is consistent only as draws grow with the
 * sample (Train 2009 §10.5.1); when the spread exceeds 10 % of a standard error the draws are
 * too few for the precision claimed (a 10 % threshold is common practice, no source).
 */
import type { EstimationResult } from '../../../shared/schemas/estimation-spec';
import type { ChoiceData } from './choice-data';
import type { MixedLogitOptions } from './check-mixed-logit-options';
import type { EstimationWarning } from './estimation-warnings';
import { fitMixedLogit, type MixedLogitResult } from './fit-mixed-logit';

export const EXTRA_SEEDS = 3;
export const NOISE_LIMIT = 0.1;

export async function checkSimulationError(
  data: ChoiceData,
  options: MixedLogitOptions & { draws: { seed: number } },
  fit: MixedLogitResult,
  signal?: AbortSignal,
): Promise<{
  result: NonNullable<EstimationResult['simulationError']>;
  warnings: EstimationWarning[];
}> {
  const seeds = Array.from({ length: EXTRA_SEEDS }, (_, i) => options.draws.seed + 1 + i);
  const runs: Float64Array[] = [fit.estimates];
  for (const seed of seeds) {
    const again = await fitMixedLogit(
      data,
      { ...options, draws: { ...options.draws, seed }, starts: 1, start: fit.estimates },
      { signal },
    );
    runs.push(again.estimates);
  }
  const se = fit.inference.used === 'robust' ? fit.robustSe : fit.se;
  const parameters = fit.names.map((name, p) => {
    const values = runs.map((r) => r[p]);
    const mean = values.reduce((a, b) => a + b, 0) / values.length;
    const spread = Math.sqrt(values.reduce((a, v) => a + (v - mean) ** 2, 0) / (values.length - 1));
    const s = Number.isFinite(se[p]) ? se[p] : null;
    return { name, spread, se: s, ratio: s ? spread / s : null };
  });
  const noisy = parameters.filter((p) => p.ratio !== null && p.ratio > NOISE_LIMIT);
  const warnings: EstimationWarning[] =
    noisy.length > 0
      ? [
          {
            code: 'simulation_noise',
            message: `With other draw seeds the estimates of ${noisy.map((p) => p.name).join(', ')} move by more than ${100 * NOISE_LIMIT} % of their standard errors (up to ${Math.round(100 * Math.max(...noisy.map((p) => p.ratio!)))} %): use more draws.`,
            parameters: noisy.map((p) => p.name),
          },
        ]
      : [];
  return { result: { seeds, parameters }, warnings };
}
