/**
 * Shares of any scenario from a run's share model (shared/schemas/shares.ts ShareModel), the
 * one implementation the browser runs on every edit and the server runs for exports:
 * - the point shares: sample enumeration over the respondents' coefficients
 *   (simulate-shares.ts);
 * - the interval: from coefficient draws made once per model (share-draws.ts) — Krinsky–Robb
 *   parameter draws for runs with one set of coefficients, each respondent's conditional
 *   distribution for individual-level runs (share-intervals.ts). For individual-level runs the
 *   reported share is the mean over the conditional draws, so that it lies inside its interval.
 */
import type { ScenarioAlternative, ShareIntervalKind, ShareModel } from '../../schemas/shares';
import { codeScenario, createScenarioCoder, type ScenarioCoder } from './code-scenario';
import {
  drawClassVectors,
  drawConditionalVectors,
  drawParameterVectors,
  type ShareDraws,
} from './share-draws';
import { simulateShareIntervals } from './share-intervals';
import { simulateShares } from './simulate-shares';

/** Draws per respondent for conditional intervals, and Krinsky–Robb draws (common practice, no source). */
export const CONDITIONAL_DRAWS = 200;
export const PARAMETER_DRAWS = 1000;

export interface PreparedShareModel {
  model: ShareModel;
  coder: ScenarioCoder;
  betas: Float64Array;
  weights: Float64Array | undefined;
  draws: ShareDraws | null;
}

/** Codes nothing yet: builds the coder and the interval draws once per model. */
export function prepareShareModel(model: ShareModel, drawCount?: number): PreparedShareModel {
  const K = model.coefficients.length;
  const coder = createScenarioCoder(
    model.definition,
    model.coefficients.map((c) => c.key),
  );
  const betas = Float64Array.from(model.betas);
  const weights = model.weights ? Float64Array.from(model.weights) : undefined;
  let draws: ShareDraws | null = null;
  const N = model.respondents;
  if (model.interval === 'parameter' && model.choleskyLower)
    draws = drawParameterVectors(
      betas,
      Float64Array.from(model.choleskyLower),
      drawCount ?? PARAMETER_DRAWS,
      model.seed,
    );
  else if (model.interval === 'conditional' && model.vectors > 1 && weights) {
    const classes = model.vectors;
    // Latent class: the class coefficients are the same for every respondent.
    draws = drawClassVectors(
      betas.subarray(0, classes * K),
      weights,
      N,
      classes,
      drawCount ?? CONDITIONAL_DRAWS,
      model.seed,
    );
  } else if (model.interval === 'conditional' && model.sds)
    draws = drawConditionalVectors(
      {
        respondents: N,
        coefficients: K,
        means: betas,
        sds: Float64Array.from(model.sds),
        lognormal: Uint8Array.from(model.coefficients, (c) => (c.lognormal ? 1 : 0)),
      },
      drawCount ?? CONDITIONAL_DRAWS,
      model.seed,
    );
  return { model, coder, betas, weights, draws };
}

export interface ScenarioShares {
  names: string[];
  /** The coded scenario, J × K in run order (welfare and exports reuse it). */
  rows: Float64Array;
  baseline: string | null;
  /** The share to report (point, or the mean over conditional draws). */
  shares: number[];
  /** Sample enumeration at the point values (conditional means, estimates). */
  pointShares: number[];
  lower: number[] | null;
  upper: number[] | null;
  interval: ShareIntervalKind | null;
  /** Per segment: G × J shares (as `shares`) and respondent counts (when groups are given). */
  groups: { shares: number[][]; counts: number[] } | null;
}

export interface ScenarioRequest {
  alternatives: readonly ScenarioAlternative[];
  includeFixed: boolean;
}

/** Shares of the J coded rows (used by scenarios and by each point of a sweep). */
export function computeRowShares(
  p: PreparedShareModel,
  rows: Float64Array,
  J: number,
  groups?: { of: Int32Array; count: number },
): Omit<ScenarioShares, 'names' | 'baseline' | 'rows'> {
  const m = p.model;
  const point = simulateShares({
    respondents: m.respondents,
    coefficients: m.coefficients.length,
    drawsPerRespondent: m.vectors,
    betas: p.betas,
    ...(p.weights ? { drawWeights: p.weights } : {}),
    alternativeCount: J,
    alternatives: rows,
    ...(groups && m.respondents > 1 ? { groups: groups.of, groupCount: groups.count } : {}),
  });
  const pointShares = Array.from(point.shares);
  const interval = p.draws ? simulateShareIntervals(p.draws, J, rows) : null;
  // Segments of an individual-level run with conditional draws: averaged over the same draws
  // as the overall share, so that the segments' shares average to it.
  const segmented =
    groups && m.respondents > 1 && p.draws?.kind === 'conditional'
      ? simulateShares({
          respondents: m.respondents,
          coefficients: m.coefficients.length,
          drawsPerRespondent: p.draws.draws,
          betas: p.draws.betas,
          alternativeCount: J,
          alternatives: rows,
          groups: groups.of,
          groupCount: groups.count,
        })
      : point;
  const central =
    interval && p.draws!.kind === 'conditional' ? Array.from(interval.mean) : pointShares;
  return {
    shares: central,
    pointShares,
    lower: interval ? Array.from(interval.lower) : null,
    upper: interval ? Array.from(interval.upper) : null,
    interval: interval ? p.draws!.kind : null,
    groups:
      groups && m.respondents > 1
        ? {
            shares: Array.from({ length: groups.count }, (_, g) =>
              Array.from(segmented.groupShares.subarray(g * J, (g + 1) * J)),
            ),
            counts: Array.from(segmented.groupCounts),
          }
        : null,
  };
}

/** Codes the scenario (throws ScenarioError with the field at fault) and simulates it. */
export function computeScenarioShares(
  p: PreparedShareModel,
  scenario: ScenarioRequest,
  groups?: { of: Int32Array; count: number },
): ScenarioShares {
  const coded = codeScenario(p.coder, scenario.alternatives, scenario.includeFixed);
  return {
    names: coded.names,
    rows: coded.rows,
    baseline: coded.baseline,
    ...computeRowShares(p, coded.rows, coded.names.length, groups),
  };
}
