/**
 * Share simulation use case ('runs:read'): codes the analyst's hypothetical alternatives with
 * the study's coding, takes each respondent's coefficients from a finished run (share-betas.ts
 * says which, per model family) and averages the respondents' logit probabilities
 * (shared/engine/shares). Beside the shares: the scenario's compensating variation against the
 * status quo (share-welfare.ts).
 */
import type { AppDeps } from '../deps';
import { ValidationError } from '../lib/errors';
import { listRunProfiles } from '../../db/queries/taste-profiles';
import { buildCodingPlan } from '../../shared/engine/coding/coding-plan';
import { codeAlternative } from '../../shared/engine/coding/code-alternative';
import { simulateShares } from '../../shared/engine/shares/simulate-shares';
import type { ShareResult, SimulateShares } from '../../shared/schemas/shares';
import { loadRunContext, type Member, type RunContext } from './tastes/run-context';
import { resolveGrouping } from './tastes/get-segments';
import { computeShareWelfare } from './share-welfare';
import { getShareBetas } from './shares/share-betas';

/** J × K coded rows of the scenario in the run's coefficient order. */
function codeScenario(
  ctx: RunContext,
  input: SimulateShares,
): { rows: Float64Array; names: string[]; baseline: string | null } {
  const plan = buildCodingPlan(ctx.definition);
  const keys = ctx.spec.coefficients.map((c) => c.column ?? c.name);
  const at = keys.map((key) => plan.columns.findIndex((c) => c.key === key));
  const K = keys.length;
  const coded: Float64Array[] = [];
  const names: string[] = [];
  input.alternatives.forEach((alt, i) => {
    if (alt.alternative >= plan.designedCount)
      throw new ValidationError('The study has fewer alternatives.', [
        { path: `alternatives.${i}.alternative`, message: 'Unknown alternative' },
      ]);
    const omitted = ctx.definition.alternatives.labels[alt.alternative]?.omittedAttributeIds ?? [];
    for (const a of ctx.definition.attributes) {
      if (!omitted.includes(a.id) && !a.levels.some((l) => l.id === alt.levels[a.id]))
        throw new ValidationError(`Choose a level of ${a.name}.`, [
          { path: `alternatives.${i}.levels.${a.id}`, message: `Choose a level of ${a.name}` },
        ]);
    }
    coded.push(codeAlternative(plan, alt.alternative, alt.levels));
    names.push(alt.name);
  });
  let baseline: string | null = null;
  if (input.includeFixed && plan.fixed) {
    coded.push(codeAlternative(plan, 'fixed', {}));
    baseline = ctx.definition.fixedAlternative!.label;
    names.push(baseline);
  }
  const rows = new Float64Array(coded.length * K);
  coded.forEach((row, j) => at.forEach((c, k) => (rows[j * K + k] = c >= 0 ? row[c] : 0)));
  return { rows, names, baseline };
}

export async function simulateStudyShares(
  deps: AppDeps,
  member: Member,
  studyId: string,
  input: SimulateShares,
): Promise<ShareResult> {
  const ctx = await loadRunContext(deps, member, studyId, input.runId);
  const { rows, names, baseline } = codeScenario(ctx, input);
  const coefficientNames = ctx.spec.coefficients.map((c) => c.name);
  const K = coefficientNames.length;
  const profiles = await listRunProfiles(deps.db, { runId: ctx.run.id, studyId });
  const { method, N, D, betas, drawWeights } = getShareBetas(ctx, profiles, coefficientNames);
  const usesProfiles = method !== 'point_estimates';
  const grouping =
    input.segmentBy && usesProfiles ? await resolveGrouping(deps, ctx, input.segmentBy) : null;
  const groups = grouping
    ? Int32Array.from(profiles, (p) => {
        const key = grouping.groupOf.get(p.respondentId);
        return key === undefined ? -1 : grouping.order.indexOf(key);
      })
    : undefined;
  const result = simulateShares({
    respondents: N,
    coefficients: K,
    betas,
    drawsPerRespondent: D,
    ...(drawWeights ? { drawWeights } : {}),
    alternativeCount: names.length,
    alternatives: rows,
    ...(grouping ? { groups, groupCount: Math.max(1, grouping.order.length) } : {}),
  });
  const J = names.length;
  const welfare = computeShareWelfare(ctx, {
    rows,
    alternativeCount: J,
    baseline,
    method,
    betas,
    respondents: N,
    vectorsPerRespondent: D,
    weights: drawWeights,
  });
  return {
    ...welfare,
    runId: ctx.run.id,
    method,
    respondents: usesProfiles ? N : ctx.results.respondents,
    alternatives: names.map((name, j) => ({ name, share: result.shares[j] })),
    segments: grouping
      ? {
          label: grouping.label,
          groups: grouping.order
            .map((key, g) => ({
              key,
              label: grouping.labelOf(key),
              count: result.groupCounts[g],
              shares: Array.from(result.groupShares.subarray(g * J, (g + 1) * J)),
            }))
            .filter((g) => g.count > 0),
        }
      : null,
  };
}
