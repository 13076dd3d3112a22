/**
 * Whether a stored design still matches a study definition after an edit: the same number of
 * designed alternatives, every shown attribute at a level that still exists, and no excluded
 * combination broken.
 */
import type { Design } from '../../shared/schemas/design';
import type { StudyDefinition } from '../../shared/schemas/study-definition';
import { listRuleBreaches } from '../engine/design/rule-breaches';

export function designFitsDefinition(definition: StudyDefinition, design: Design): boolean {
  const { count, labeled, labels } = definition.alternatives;
  const levelsOf = new Map(
    definition.attributes.map((a) => [a.id, new Set(a.levels.map((l) => l.id))]),
  );
  const shapeFits = design.tasks.every(
    (task) =>
      task.alternatives.length === count &&
      task.alternatives.every((alt, j) => {
        const omitted = new Set(labeled ? (labels[j]?.omittedAttributeIds ?? []) : []);
        const keys = Object.keys(alt.levels);
        if (keys.some((k) => !levelsOf.has(k))) return false;
        return definition.attributes.every((a) =>
          omitted.has(a.id)
            ? alt.levels[a.id] === undefined
            : levelsOf.get(a.id)!.has(alt.levels[a.id] ?? ''),
        );
      }),
  );
  return shapeFits && listRuleBreaches(definition, design).length === 0;
}
