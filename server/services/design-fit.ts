/**
 * Whether a stored design still matches a study definition after an edit: the same number of
 * designed alternatives, and every shown attribute at a level that still exists.
 */
import type { Design } from '../../shared/schemas/design';
import type { StudyDefinition } from '../../shared/schemas/study-definition';

export function designFitsDefinition(definition: StudyDefinition, design: Design): boolean {
  const { count, labeled, labels } = definition.alternatives;
  const levelsOf = new Map(
    definition.attributes.map((a) => [a.id, new Set(a.levels.map((l) => l.id))]),
  );
  const prohibited = definition.prohibitions;
  return design.tasks.every(
    (task) =>
      task.alternatives.length === count &&
      task.alternatives.every((alt, j) => {
        const omitted = new Set(labeled ? (labels[j]?.omittedAttributeIds ?? []) : []);
        const keys = Object.keys(alt.levels);
        if (keys.some((k) => !levelsOf.has(k))) return false;
        const shownOk = definition.attributes.every((a) =>
          omitted.has(a.id)
            ? alt.levels[a.id] === undefined
            : levelsOf.get(a.id)!.has(alt.levels[a.id] ?? ''),
        );
        const allowed = prohibited.every(
          (p) =>
            !(
              alt.levels[p.a.attributeId] === p.a.levelId &&
              alt.levels[p.b.attributeId] === p.b.levelId
            ),
        );
        return shownOk && allowed;
      }),
  );
}
