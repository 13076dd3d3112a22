/**
 * The coefficients a share simulation averages over, by model family (sample enumeration,
 * Train 2009, §2.6.1 and §11.6):
 * - MNL: the point estimates, one set for everybody;
 * - mixed logit: each respondent's conditional means (Revelt & Train 2000). The run keeps each
 *   respondent's mean and SD, not weighted draws, so the uncertainty within a respondent is left
 *   out (stated in the UI);
 * - HB: each respondent's posterior means. The posterior draws are not stored, so the shares
 *   are not averaged over them; with flat posteriors (few tasks) this makes individual
 *   probabilities more extreme than the posterior predictive ones (stated in the UI);
 * - latent class: for each respondent every class's coefficients, weighted by the respondent's
 *   posterior class probabilities: P_nj = Σ_c h_nc P_j(β_c) (Greene & Hensher 2003, §4), the
 *   exact class-mixture probability, not the logit at the class-weighted mean.
 */
import type { ProfileRow } from '../../../db/queries/taste-profiles';
import type { ShareMethod } from '../../../shared/schemas/shares';
import type { RunContext } from '../tastes/run-context';

export type ShareBetas = {
  method: ShareMethod;
  /** Respondents (1 for point estimates). */
  N: number;
  /** Coefficient vectors per respondent (classes for latent class, else 1). */
  D: number;
  /** (N·D) × K, coefficient order of `names`. */
  betas: Float64Array;
  /** N × D weights (latent class posterior class probabilities). */
  drawWeights?: Float64Array;
};

const METHOD_OF_MODEL: Record<string, ShareMethod> = {
  mixed: 'conditional_means',
  hb: 'posterior_means',
  latent_class: 'class_weighted',
};

export function getShareBetas(
  ctx: Pick<RunContext, 'run' | 'results'>,
  profiles: readonly Pick<ProfileRow, 'mean' | 'extra'>[],
  names: readonly string[],
  /** Names of the point estimates (MNL runs name them by data column); default `names`. */
  estimateNames: readonly string[] = names,
): ShareBetas {
  const K = names.length;
  const method = METHOD_OF_MODEL[ctx.run.model];
  const classes = ctx.results.classes ?? [];
  if (method === 'class_weighted' && classes.length > 0 && profiles.length > 0) {
    const N = profiles.length;
    const D = classes.length;
    const betas = new Float64Array(N * D * K);
    const drawWeights = new Float64Array(N * D);
    const classBetas = classes.map((c) =>
      names.map((name) => c.estimates.find((e) => e.name === name)?.estimate ?? 0),
    );
    profiles.forEach((p, n) => {
      const h = (p.extra as { classProbabilities?: number[] } | null)?.classProbabilities;
      for (let d = 0; d < D; d++) {
        // A profile without probabilities (not expected) falls back to the class shares.
        drawWeights[n * D + d] = h?.[d] ?? classes[d].share;
        betas.set(classBetas[d], (n * D + d) * K);
      }
    });
    return { method, N, D, betas, drawWeights };
  }
  if ((method === 'conditional_means' || method === 'posterior_means') && profiles.length > 0) {
    const N = profiles.length;
    const betas = new Float64Array(N * K);
    profiles.forEach((p, n) => {
      const mean = p.mean as Record<string, number>;
      names.forEach((name, k) => (betas[n * K + k] = mean[name] ?? 0));
    });
    return { method, N, D: 1, betas };
  }
  const betas = Float64Array.from(
    estimateNames,
    (name) => ctx.results.estimates.find((e) => e.name === name)?.estimate ?? 0,
  );
  return { method: 'point_estimates', N: 1, D: 1, betas };
}
