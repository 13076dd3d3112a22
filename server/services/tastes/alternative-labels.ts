/** Readable names of a task's alternatives and of levels, from the study definition. */
import type { StudyDefinition } from '../../../shared/schemas/study-definition';
import { getLevelLabel } from '../../../shared/study/level-labels';

/** Designed alternative `index` (0-based) or −1 for the opt-out / status quo. */
export function getAlternativeLabel(definition: StudyDefinition, index: number): string {
  if (index < 0) return definition.fixedAlternative?.label ?? 'Fixed alternative';
  if (definition.alternatives.labeled)
    return definition.alternatives.labels[index]?.name ?? `Alternative ${index + 1}`;
  return `Alternative ${index + 1}`;
}

/** Indexes of every alternative of a task: designed ones, then −1 when the study has one. */
export function getAlternativeIndexes(definition: StudyDefinition): number[] {
  const indexes = Array.from({ length: definition.alternatives.count }, (_, i) => i);
  return definition.fixedAlternative ? [...indexes, -1] : indexes;
}

/** attribute name → level label for a level map (attribute id → level id). */
export function describeLevels(
  definition: StudyDefinition,
  levels: Record<string, string>,
): Record<string, string> {
  const out: Record<string, string> = {};
  for (const a of definition.attributes) {
    const level = a.levels.find((l) => l.id === levels[a.id]);
    if (level) out[a.name] = getLevelLabel(a, level);
  }
  return out;
}
