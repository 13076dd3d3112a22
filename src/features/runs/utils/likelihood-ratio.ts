/**
 * Likelihood-ratio tests between two finished runs when one is nested in the other (Greene
 * 2018, Econometric Analysis, 8th ed., §14.6.1): LR = 2(LL_general − LL_restricted) is χ² with
 * df = the difference in parameter counts under the restriction. Two runs are nested when they
 * used the same data (same data hash), the same space, and the restricted run's model is the
 * general one with some coefficients left out (fixed at 0), some random coefficients fixed
 * (their spread at 0), or correlations switched off. A restriction that puts a spread at 0 lies
 * on the boundary of the parameter space, where the χ² p-value is conservative (Self & Liang
 * 1987, JASA 82:605-610). Otherwise the runs are reported as not nested, with the reason.
 */
import chisquareCdf from '@stdlib/stats-base-dists-chisquare-cdf';
import type { Run, RunResult } from '@shared/schemas/run';

type DoneRun = Run & { results: RunResult };

export type LrComparison =
  | {
      nested: true;
      restricted: DoneRun;
      general: DoneRun;
      statistic: number;
      df: number;
      p: number;
      boundary: boolean;
      note: string | null;
    }
  | { nested: false; a: DoneRun; b: DoneRun; reason: string };

const SPREAD_FAMILIES = ['normal', 'triangular', 'uniform'];

/** Why `r` is not a restriction of `g`, or null when it is (boundary: a spread set to 0). */
function whyNotRestriction(r: DoneRun, g: DoneRun): { reason: string | null; boundary: boolean } {
  let boundary = false;
  const general = new Map(g.spec.coefficients.map((c) => [c.name, c]));
  for (const c of r.spec.coefficients) {
    const other = general.get(c.name);
    if (!other) return { reason: `${g.name} has no coefficient ${c.name}`, boundary };
    if ((other.column ?? other.name) !== (c.column ?? c.name))
      return { reason: `${c.name} reads different columns`, boundary };
    if (other.distribution === c.distribution) continue;
    if (c.distribution === 'fixed' && SPREAD_FAMILIES.includes(other.distribution)) {
      boundary = true;
      continue;
    }
    return {
      reason: `${c.name} is ${c.distribution} in ${r.name} and ${other.distribution} in ${g.name}, and neither distribution is a special case of the other`,
      boundary,
    };
  }
  if (r.spec.correlated && !g.spec.correlated)
    return { reason: `${r.name} has correlated tastes and ${g.name} does not`, boundary };
  return { reason: null, boundary };
}

export function compareRuns(a: DoneRun, b: DoneRun): LrComparison {
  const notNested = (reason: string): LrComparison => ({ nested: false, a, b, reason });
  if (!a.dataHash || a.dataHash !== b.dataHash)
    return notNested('they were estimated on different data (respondents or columns)');
  // HB's LL is simulated at the posterior means, not a maximum: no LR test.
  if (a.model === 'hb' || b.model === 'hb')
    return notNested(
      'a hierarchical Bayes run has no maximised log-likelihood; compare the log marginal density and the hit rates instead',
    );
  // Fewer classes put some class shares on the boundary (0), where the LR statistic is not χ²
  // (McLachlan & Peel 2000, Finite Mixture Models, ch. 6; from memory): choose classes by BIC/CAIC.
  if (a.model === 'latent_class' || b.model === 'latent_class')
    return notNested(
      'the number of latent classes is not tested by a χ² likelihood-ratio test; compare BIC and CAIC instead',
    );
  if ((a.spec.space ?? 'preference') !== (b.spec.space ?? 'preference'))
    return notNested('one is in preference space and the other in WTP space');
  const [ra, rb] = [whyNotRestriction(a, b), whyNotRestriction(b, a)];
  const pa = a.results.parameters;
  const pb = b.results.parameters;
  let restricted: DoneRun;
  let general: DoneRun;
  let boundary: boolean;
  if (ra.reason === null && pa < pb) [restricted, general, boundary] = [a, b, ra.boundary];
  else if (rb.reason === null && pb < pa) [restricted, general, boundary] = [b, a, rb.boundary];
  else if (ra.reason === null && rb.reason === null)
    return notNested('they are the same model (equal numbers of parameters)');
  else return notNested(ra.reason ?? rb.reason ?? 'they are not nested');
  const statistic = 2 * (general.results.loglik - restricted.results.loglik);
  const df = general.results.parameters - restricted.results.parameters;
  const notes: string[] = [];
  if (statistic < 0)
    notes.push(
      `${general.name} has the lower log-likelihood although it contains ${restricted.name}: it did not reach its maximum`,
    );
  if (boundary)
    notes.push('a spread is restricted to 0, on its boundary: the p-value is conservative');
  if (general.model === 'mixed' || restricted.model === 'mixed')
    notes.push('simulated log-likelihoods: compare runs with the same draws');
  return {
    nested: true,
    restricted,
    general,
    statistic,
    df,
    p: statistic > 0 ? 1 - chisquareCdf(statistic, df) : 1,
    boundary,
    note: notes.length > 0 ? notes.join('; ') : null,
  };
}

/** Every pair of the given runs, in order. */
export function compareAllPairs(runs: DoneRun[]): LrComparison[] {
  const out: LrComparison[] = [];
  for (let i = 0; i < runs.length; i++)
    for (let j = i + 1; j < runs.length; j++) out.push(compareRuns(runs[i], runs[j]));
  return out;
}
