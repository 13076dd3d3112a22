/**
 * A table that says what its columns are: every export file built from one carries a codebook
 * (column, meaning, unit, coding), as a sheet of the XLSX or a CSV beside the data. The column
 * format tells the XLSX writer which number format to set; CSV cells stay plain numbers.
 */
import { writeCsv, type CellValue } from '../../lib/safe-csv';

export type ColumnFormat =
  'text' | 'integer' | 'logical' | 'estimate' | 'p' | 'ratio' | 'money' | 'seconds';

export interface ColumnDoc {
  key: string;
  meaning: string;
  /** "none" for text and codes; a unit in words otherwise. */
  unit: string;
  coding: string;
  format: ColumnFormat;
  /** Text columns with a fixed set of values: the levels in order (an R factor's levels). */
  levels?: readonly string[];
}

export interface DocumentedTable {
  /** File or sheet name, e.g. "estimates". */
  name: string;
  columns: ColumnDoc[];
  rows: CellValue[][];
}

export const codebookHeader = ['file', 'column', 'meaning', 'unit', 'coding'];

/** One codebook row per column of each table, in table then column order. */
export function buildCodebookRows(tables: readonly DocumentedTable[]): CellValue[][] {
  return tables.flatMap((t) => t.columns.map((c) => [t.name, c.key, c.meaning, c.unit, c.coding]));
}

/** Shorthand for a column description. */
export const col = (
  key: string,
  format: ColumnFormat,
  meaning: string,
  unit = 'none',
  coding = format === 'text' ? 'text' : 'number',
): ColumnDoc => ({ key, meaning, unit, coding, format });

/** The table as a CSV file: one column per documented column, headed by its key. */
export function writeDocumentedCsv(table: DocumentedTable): string {
  return writeCsv(
    table.columns.map((c) => c.key),
    table.rows,
  );
}
