/**
 * Matches every value of the attribute columns to a level of the set-up: numeric attributes
 * by value (so "3" and "3.0" are one level), categorical ones by their text. Values that are
 * not numbers in a numeric attribute, or that are no level at all, become problems at the
 * first line they appear on, with how many lines hold them.
 */
import type { ImportAttribute } from '../../../shared/schemas/study-import';
import { readNumber } from './column-dictionary';
import type { ChoiceFileScan } from './read-choice-file';

export interface MatchedAttribute {
  attribute: ImportAttribute;
  /** Index of the column in scan.columns. */
  columnIndex: number;
  /** Dictionary code → level index (−1: no level). */
  levelOfCode: Int32Array;
}

const lines = (n: number) => (n === 1 ? '1 line' : `${n.toLocaleString('en')} lines`);

export function matchLevels(
  scan: ChoiceFileScan,
  attributes: readonly ImportAttribute[],
): MatchedAttribute[] {
  const matched: MatchedAttribute[] = [];
  for (const attribute of attributes) {
    const columnIndex = scan.columns.findIndex((c) => c.name === attribute.column);
    if (columnIndex < 0) {
      scan.problems.add({
        file: 'choices',
        line: 1,
        column: attribute.column,
        code: 'missing_column',
        message: `The file has no column “${attribute.column}” for the attribute ${attribute.name}.`,
      });
      continue;
    }
    const column = scan.columns[columnIndex];
    const tooMany = column.values.length > 12 || column.overflowLine !== null;
    const levelOfCode = new Int32Array(column.values.length).fill(-1);
    column.values.forEach((v, code) => {
      let level = -1;
      if (attribute.kind === 'numeric') {
        const x = readNumber(v.raw);
        if (x === null) {
          scan.problems.add({
            file: 'choices',
            line: v.firstLine,
            column: column.name,
            code: 'not_numeric',
            message: `${attribute.name} is numeric, but “${v.raw}” is not a number (${lines(v.count)}).`,
          });
          return;
        }
        level = attribute.levels.findIndex((l) => (l.value ?? readNumber(l.raw)) === x);
      } else level = attribute.levels.findIndex((l) => l.raw === v.raw);
      if (level >= 0) levelOfCode[code] = level;
      else
        scan.problems.add({
          file: 'choices',
          line: v.firstLine,
          column: column.name,
          code: tooMany ? 'too_many_levels' : 'unknown_level',
          message: tooMany
            ? `${attribute.name} has more than 12 different values (“${v.raw}” is one too many): recode the column, or leave the attribute out.`
            : `“${v.raw}” is not a level of ${attribute.name} (${lines(v.count)}).`,
        });
    });
    matched.push({ attribute, columnIndex, levelOfCode });
  }
  return matched;
}
