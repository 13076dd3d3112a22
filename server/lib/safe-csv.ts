/**
 * The one CSV writer of the product: every CSV download goes through writeCsv, header included.
 * CSV cells safe to open in a spreadsheet. A text cell starting with =, +, −, @, tab or
 * carriage return can be run as a formula by spreadsheet programs ("CSV injection"; OWASP,
 * "CSV Injection" page [M]); such cells get a leading single quote. Numbers are written as
 * numbers and never escaped, so −1.23 stays a number: a finite JavaScript number serialises
 * to digits, sign, point and exponent only, which no spreadsheet reads as a formula.
 * Decision: the type of the value decides — text is escaped even when it looks numeric.
 */
import { stringify } from 'csv-stringify/sync';

export type CellValue = string | number | boolean | null | undefined;

const FORMULA_START = /^[=+\-@\t\r]/;

/** Escapes one text cell (see the file comment). */
export function escapeCsvText(text: string): string {
  return FORMULA_START.test(text) ? `'${text}` : text;
}

/** Reads back a cell written by escapeCsvText (our own exports re-imported). */
export function unescapeCsvText(text: string): string {
  return text.startsWith("'") && FORMULA_START.test(text.slice(1)) ? text.slice(1) : text;
}

/** The CSV text of one value: numbers as numbers (non-finite as empty), text escaped. */
export function toCsvCell(value: CellValue): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  if (typeof value === 'boolean') return value ? 'true' : 'false';
  return escapeCsvText(value);
}

/** A whole CSV document (RFC 4180 quoting by csv-stringify) with escaped text cells. */
export function writeCsv(
  header: readonly string[],
  rows: readonly (readonly CellValue[])[],
): string {
  return writeCsvRecords([header, ...rows]);
}

/**
 * Records without a header, each ending in its line break: documents written in parts and
 * joined in order are the document written whole.
 */
export function writeCsvRecords(records: readonly (readonly CellValue[])[]): string {
  return stringify(records.map((row) => row.map(toCsvCell)));
}
