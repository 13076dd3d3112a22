/**
 * Short machine names ("codes") for a study's coded columns, made from their readable names:
 * "River health: good" → river_health_good. They head the long-format CSV and name the
 * coefficients the Models form proposes (the estimation spec allows only [A-Za-z0-9_.-]).
 */
import type { CodedColumn } from '../../../shared/engine/coding/coded-columns';

function slugify(text: string): string {
  const slug = text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '_')
    .replace(/^_+|_+$/g, '')
    .slice(0, 60);
  if (slug === '') return 'column';
  return /^[0-9]/.test(slug) ? `_${slug}` : slug;
}

/** One unique code per column, in column order; units in parentheses are dropped. */
export function getColumnCodes(columns: readonly CodedColumn[]): string[] {
  const used = new Set<string>(['respondent', 'task', 'alt', 'chosen', 'holdout']);
  return columns.map((column) => {
    const base =
      column.kind === 'constant'
        ? `asc_${slugify(column.name.replace(/^Constant:\s*/, ''))}`
        : slugify(column.name.replace(/\s*\([^)]*\)\s*$/, ''));
    let code = base;
    for (let i = 2; used.has(code); i++) code = `${base}_${i}`;
    used.add(code);
    return code;
  });
}
