/**
 * Writes a design as CSV: one row per designed alternative, columns `block,task,alternative`
 * then one column per attribute headed by the attribute name. Cells hold the level label,
 * or the numeric value for numeric attributes; an attribute a labeled alternative omits is
 * left empty. The opt-out / status quo is not written (the study definition fixes it).
 */
import { stringify } from 'csv-stringify/sync';
import type { Design } from '../../../shared/schemas/design';
import type { Attribute, StudyDefinition } from '../../../shared/schemas/study-definition';
import { getLevelLabel } from '../../../shared/study/level-labels';

/** The cell text of a level: its numeric value for numeric attributes, else its label. */
export function getLevelCell(attribute: Attribute, levelId: string | undefined): string {
  if (levelId === undefined) return '';
  const level = attribute.levels.find((l) => l.id === levelId);
  if (!level) return '';
  return attribute.kind === 'numeric' && level.value !== undefined
    ? String(level.value)
    : getLevelLabel(attribute, level);
}

export function exportDesignCsv(definition: StudyDefinition, design: Design): string {
  const header = ['block', 'task', 'alternative', ...definition.attributes.map((a) => a.name)];
  const rows: string[][] = [];
  for (const task of design.tasks)
    task.alternatives.forEach((alternative, j) => {
      rows.push([
        String(task.block),
        String(task.task),
        String(j + 1),
        ...definition.attributes.map((a) => getLevelCell(a, alternative.levels[a.id])),
      ]);
    });
  return stringify([header, ...rows]);
}
