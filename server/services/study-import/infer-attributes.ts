/**
 * A first set-up from the columns themselves, for the researcher to edit: a column whose
 * values are mostly numbers is a numeric attribute coded linearly (levels ascending; its
 * other values are then reported as not numeric), any other column a categorical attribute in
 * dummy coding with its values as levels in order of appearance. The first numeric column
 * named like a price is the cost. Columns that are empty or hold one value are left out:
 * they cannot explain a choice. Common practice, no source.
 */
import type { ImportAttribute } from '../../../shared/schemas/study-import';
import { readNumber, type ColumnDictionary } from './column-dictionary';

const COST_NAME = /price|cost|bill|fee|pay|charge|tariff/i;
const MAX_LEVELS = 12;

/** Readable attribute name from a column name ("river_health" → "River health"). */
function nameOf(column: string): string {
  const words = column.replace(/[_.]+/g, ' ').trim();
  return (words.charAt(0).toUpperCase() + words.slice(1)).slice(0, 120) || column;
}

export function inferAttributes(columns: readonly ColumnDictionary[]): ImportAttribute[] {
  const attributes: ImportAttribute[] = [];
  let costTaken = false;
  for (const column of columns) {
    const distinct = column.values;
    if (distinct.length < 2) continue;
    const numbers = distinct.map((v) => readNumber(v.raw));
    const numeric = numbers.filter((x) => x !== null).length * 2 > distinct.length;
    const base = { column: column.name, name: nameOf(column.name) };
    if (numeric) {
      const byValue = new Map<number, string>();
      distinct.forEach((v, i) => {
        const x = numbers[i];
        if (x !== null && !byValue.has(x)) byValue.set(x, v.raw);
      });
      const values = [...byValue.keys()].sort((a, b) => a - b).slice(0, MAX_LEVELS);
      if (values.length < 2) continue;
      const isCost: boolean = !costTaken && COST_NAME.test(column.name);
      costTaken ||= isCost;
      attributes.push({
        ...base,
        kind: 'numeric',
        coding: 'linear',
        isCost,
        levels: values.map((value) => ({ raw: byValue.get(value)!, label: '', value })),
      });
    } else {
      attributes.push({
        ...base,
        kind: 'categorical',
        coding: 'dummy',
        isCost: false,
        levels: distinct.slice(0, MAX_LEVELS).map((v) => ({ raw: v.raw, label: v.raw })),
      });
    }
  }
  return attributes.slice(0, 20);
}
