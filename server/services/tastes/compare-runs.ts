/**
 * Two runs' individual estimates side by side: for each coefficient both runs have, every
 * respondent's pair of individual means (mixed logit conditional mean, HB posterior mean,
 * latent class posterior-weighted mean) and their Pearson correlation. Respondents are matched
 * by id; only those with a profile in both runs count. No respondent ids leave the server.
 */
import type { AppDeps } from '../../deps';
import { listRunProfiles } from '../../../db/queries/taste-profiles';
import { pearsonCorrelation } from '../../../shared/engine/stats/pearson-correlation';
import type { TasteComparison } from '../../../shared/schemas/tastes';
import { loadRunContext } from './run-context';
import type { Actor } from '../actor';

export async function compareRuns(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  query: { runId: string; otherRunId: string },
): Promise<TasteComparison> {
  const [a, b] = await Promise.all([
    loadRunContext(deps, actor, studyId, query.runId),
    loadRunContext(deps, actor, studyId, query.otherRunId),
  ]);
  const [rowsA, rowsB] = await Promise.all([
    listRunProfiles(deps.db, { runId: query.runId, studyId }),
    listRunProfiles(deps.db, { runId: query.otherRunId, studyId }),
  ]);
  const meansB = new Map(rowsB.map((r) => [r.respondentId, r.mean as Record<string, number>]));
  const matched = rowsA
    .filter((r) => meansB.has(r.respondentId))
    .map((r) => [r.mean as Record<string, number>, meansB.get(r.respondentId)!] as const);
  const otherNames = new Set(b.header.coefficients.map((c) => c.name));
  const coefficients = a.header.coefficients
    .filter((c) => otherNames.has(c.name))
    .map((c) => {
      const pairs = matched
        .map(([x, y]) => [x[c.name], y[c.name]] as [number, number])
        .filter(([x, y]) => Number.isFinite(x) && Number.isFinite(y));
      const diff = pairs.reduce((s, [x, y]) => s + (y - x), 0);
      return {
        name: c.name,
        label: c.label,
        correlation: pearsonCorrelation(
          pairs.map((p) => p[0]),
          pairs.map((p) => p[1]),
        ),
        meanDifference: pairs.length > 0 ? diff / pairs.length : NaN,
        pairs,
      };
    });
  return {
    run: a.header.run,
    other: b.header.run,
    respondents: matched.length,
    coefficients,
  };
}
