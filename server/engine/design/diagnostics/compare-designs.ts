/**
 * The current and a candidate design side by side under the candidate's (new) priors: every
 * criterion of both, so the gain of a redesign is visible before anything changes. The
 * current design is diagnosed with the candidate's priors, seed and criterion settings, so both
 * columns average over the same prior draws.
 */
import type { Design } from '../../../../shared/schemas/design';
import type { DesignSpec } from '../../../../shared/schemas/design-spec';
import type { CriterionComparison } from '../../../../shared/schemas/redesign';
import type { StudyDefinition } from '../../../../shared/schemas/study-definition';
import { diagnoseDesign } from './diagnose-design';
import type { DesignDiagnostics } from '../../../../shared/schemas/design-diagnostics';

export function compareDesigns(
  definition: StudyDefinition,
  current: Design,
  candidate: DesignDiagnostics,
  spec: DesignSpec,
): CriterionComparison[] {
  const before = diagnoseDesign(definition, current, spec.priors, spec.seed, spec).criteria!;
  return candidate.criteria!.values.map((after) => {
    const old = before.values.find((v) => v.criterion === after.criterion);
    return {
      criterion: after.criterion,
      current: old?.value ?? null,
      candidate: after.value,
      unavailable: after.unavailable,
    };
  });
}
