/**
 * Writes a design as CSV: one row per designed alternative, columns `block,task,alternative`
 * then one column per attribute headed by the attribute name. Cells hold the level label,
 * or the numeric value for numeric attributes; an attribute a labeled alternative omits is
 * left empty. The opt-out / status quo is not written (the study definition fixes it).
 * Attribute names and level labels are free text, so the text goes through the one safe CSV
 * writer (server/lib/safe-csv.ts); numbers stay numbers.
 */
import type { Design } from '../../../shared/schemas/design';
import type { Attribute, StudyDefinition } from '../../../shared/schemas/study-definition';
import { getLevelLabel } from '../../../shared/study/level-labels';
import { writeCsv, type CellValue } from '../../lib/safe-csv';

/** The cell of a level: its numeric value for numeric attributes, else its label. */
export function getLevelCell(attribute: Attribute, levelId: string | undefined): CellValue {
  if (levelId === undefined) return '';
  const level = attribute.levels.find((l) => l.id === levelId);
  if (!level) return '';
  return attribute.kind === 'numeric' && level.value !== undefined
    ? level.value
    : getLevelLabel(attribute, level);
}

export function exportDesignCsv(definition: StudyDefinition, design: Design): string {
  const header = ['block', 'task', 'alternative', ...definition.attributes.map((a) => a.name)];
  const rows: CellValue[][] = [];
  for (const task of design.tasks)
    task.alternatives.forEach((alternative, j) => {
      rows.push([
        task.block,
        task.task,
        j + 1,
        ...definition.attributes.map((a) => getLevelCell(a, alternative.levels[a.id])),
      ]);
    });
  return writeCsv(header, rows);
}
