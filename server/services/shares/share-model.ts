/**
 * The share model of a run (shared/schemas/shares.ts ShareModel): what the browser needs to
 * recompute shares of any scenario itself, and what the server's exports recompute from with
 * the same shared code (shared/engine/shares/share-model.ts). Coefficients per family as
 * share-betas.ts decides; the interval from the estimates' covariance (MNL: its Cholesky
 * factor, for Krinsky–Robb draws) or from each respondent's conditional distribution
 * (mixed logit and HB: conditional means and SDs; latent class: class probabilities).
 */
import { choleskyDecompose } from '../../engine/linalg/cholesky';
import type { ProfileRow } from '../../../db/queries/taste-profiles';
import type { ShareModel } from '../../../shared/schemas/shares';
import type { RunContext } from '../tastes/run-context';
import { getShareBetas } from './share-betas';

/**
 * The names the run's estimates and covariance carry, in coefficient order: an MNL run names
 * them by data column ("attr:bill"), a mixed logit by coefficient name; each is looked up as
 * the coefficient's name first, then its column.
 */
export function estimateNamesOf(ctx: Pick<RunContext, 'spec' | 'results'>): string[] {
  const known = new Set((ctx.results.estimates ?? []).map((e) => e.name));
  return ctx.spec.coefficients.map((c) =>
    known.has(c.name) || !c.column || !known.has(c.column) ? c.name : c.column,
  );
}

/** The estimates' covariance in coefficient order, or null when any entry is unknown. */
export function covarianceOf(ctx: RunContext, names: readonly string[]): Float64Array | null {
  const cov = ctx.results.covariance;
  const matrix = cov ? cov[cov.used] : null;
  if (!cov || !matrix) return null;
  const at = names.map((n) => cov.names.indexOf(n));
  if (at.some((i) => i < 0)) return null;
  const K = names.length;
  const out = new Float64Array(K * K);
  for (let a = 0; a < K; a++)
    for (let b = 0; b < K; b++) {
      const v = matrix[at[a]][at[b]];
      if (v === null) return null;
      out[a * K + b] = v;
    }
  return out;
}

/** The run's seed: a mixed logit's draws seed, else 1 (the welfare interval's seed too). */
export function shareSeedOf(ctx: Pick<RunContext, 'spec'>): number {
  return ctx.spec.model === 'mixed' ? ctx.spec.draws.seed : 1;
}

export function buildShareModel(
  ctx: RunContext,
  profiles: readonly Pick<ProfileRow, 'mean' | 'sd' | 'extra'>[],
): ShareModel {
  const names = ctx.spec.coefficients.map((c) => c.name);
  const K = names.length;
  const estimateNames = estimateNamesOf(ctx);
  const { method, N, D, betas, drawWeights } = getShareBetas(ctx, profiles, names, estimateNames);
  const lognormal = (name: string) =>
    /lognormal/.test(ctx.results.population.find((p) => p.name === name)?.distribution ?? '');
  const base = {
    runId: ctx.run.id,
    model: ctx.run.model,
    method,
    definition: ctx.definition,
    coefficients: ctx.spec.coefficients.map((c) => ({
      name: c.name,
      key: c.column ?? c.name,
      lognormal: lognormal(c.name),
    })),
    respondents: N,
    vectors: D,
    betas: Array.from(betas),
    weights: drawWeights ? Array.from(drawWeights) : null,
    seed: shareSeedOf(ctx),
    sampleRespondents: method === 'point_estimates' ? ctx.results.respondents : N,
  };
  if (method === 'point_estimates') {
    const cov = covarianceOf(ctx, estimateNames);
    const lower = new Float64Array(K * K);
    const ok = cov !== null && choleskyDecompose(cov, K, lower);
    return {
      ...base,
      sds: null,
      choleskyLower: ok ? Array.from(lower) : null,
      interval: ok ? 'parameter' : null,
      intervalNote: ok
        ? null
        : 'The run has no usable covariance of its estimates, so the shares carry no interval.',
    };
  }
  if (method === 'class_weighted')
    return { ...base, sds: null, choleskyLower: null, interval: 'conditional', intervalNote: null };
  const sds = new Float64Array(N * K);
  profiles.forEach((p, n) => {
    const sd = (p.sd ?? {}) as Record<string, number>;
    names.forEach((name, k) => {
      const v = sd[name];
      sds[n * K + k] = Number.isFinite(v) && v > 0 ? v : 0;
    });
  });
  return {
    ...base,
    sds: Array.from(sds),
    choleskyLower: null,
    interval: 'conditional',
    intervalNote: null,
  };
}
