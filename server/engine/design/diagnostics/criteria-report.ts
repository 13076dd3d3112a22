/**
 * The four design criteria of one design under its priors (design-criteria.ts): the value of
 * each (averaged over the prior draws for Bayesian priors, at the means otherwise), or the
 * reason it cannot be computed, and which one the search minimised.
 */
import type { CodingPlan } from '../../../../shared/engine/coding/coding-plan';
import type { DesignCriterion } from '../../../../shared/schemas/design-spec';
import type { StudyDefinition } from '../../../../shared/schemas/study-definition';
import {
  buildCriterionSetup,
  computeDesignCriterion,
  getCriterionUnavailableReason,
} from '../design-criteria';
import type { CriterionValue, CriteriaReport } from '../../../../shared/schemas/design-diagnostics';

const ORDER: DesignCriterion[] = ['d_error', 'a_error', 's_estimate', 'c_error'];

/** Computes the report; `dError` is the D-error the diagnostics already computed. */
export function getCriteriaReport(input: {
  plan: CodingPlan;
  definition: StudyDefinition;
  design: { S: number; Jt: number; x: Float64Array };
  draws: Float64Array;
  R: number;
  means: Float64Array;
  dError: number | null;
  searched: DesignCriterion;
  tValue: number;
}): CriteriaReport {
  const { plan, definition, design, draws, R, means, tValue } = input;
  const values = ORDER.map((criterion): CriterionValue => {
    if (criterion === 'd_error') return { criterion, value: input.dError, unavailable: null };
    const setup = buildCriterionSetup(plan, definition, criterion, means, tValue);
    const unavailable = getCriterionUnavailableReason(setup, criterion, means);
    if (unavailable) return { criterion, value: null, unavailable };
    const value = computeDesignCriterion(setup, design.S, design.Jt, design.x, draws, R);
    return { criterion, value: Number.isFinite(value) ? value : null, unavailable: null };
  });
  return { searched: input.searched, tValue, values };
}
