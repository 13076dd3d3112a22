/**
 * One column of a choice file held as small integer codes: each distinct text gets a code the
 * first time it is seen, with the line it was first seen on and how often it occurs. A million
 * rows of a 5-level attribute are then a million small numbers, not a million strings.
 */

/** Code of an empty cell. */
export const BLANK = -1;
/** Code of a value past the distinct-value cap (the column has too many levels anyway). */
export const OVERFLOW = -2;
/** Distinct values kept per column: far above the 12 levels an attribute may have. */
const MAX_DISTINCT = 1000;

export interface DistinctValue {
  raw: string;
  firstLine: number;
  count: number;
}

export class ColumnDictionary {
  readonly values: DistinctValue[] = [];
  readonly codes: number[] = [];
  overflowLine: number | null = null;
  blanks = 0;
  private index = new Map<string, number>();

  constructor(readonly name: string) {}

  /** Records the cell of the next row and returns its code. */
  push(raw: string, line: number): number {
    let code: number;
    if (raw === '') {
      code = BLANK;
      this.blanks++;
    } else {
      const known = this.index.get(raw);
      if (known !== undefined) {
        code = known;
        this.values[code].count++;
      } else if (this.values.length < MAX_DISTINCT) {
        code = this.values.length;
        this.index.set(raw, code);
        this.values.push({ raw, firstLine: line, count: 1 });
      } else {
        code = OVERFLOW;
        this.overflowLine ??= line;
      }
    }
    this.codes.push(code);
    return code;
  }
}

/** A cell's text as a number, or null when it is not one (empty text included). */
export function readNumber(raw: string): number | null {
  if (raw.trim() === '') return null;
  const value = Number(raw);
  return Number.isFinite(value) ? value : null;
}
