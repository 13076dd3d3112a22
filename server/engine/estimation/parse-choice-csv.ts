/**
 * Reads long-format choice data from CSV text: one row per alternative with the columns
 * respondent, task, alt, chosen (0/1), optionally holdout (0/1), and numeric attribute
 * columns. Only the attribute columns a model needs are parsed, so extra text columns are
 * allowed. An optional `included` column (true/false or 1/0, as the study's long choice file
 * writes it) leaves the rows of respondents who do not count out. Errors name the line (the
 * header is line 1) and the column. Comma, semicolon or tab separated, as the header line shows,
 * with decimal commas in a semicolon file (server/lib/csv-dialect.ts).
 */
import {
  keyColumnIndex,
  readCsvText,
  withDecimalPoint,
  type CsvDelimiter,
  type CsvRecord,
} from '../../lib/csv-dialect';
import { ChoiceDataError, type LongChoiceRow } from './choice-data';

const REQUIRED = ['respondent', 'task', 'alt', 'chosen'] as const;

/** Parses the CSV and returns rows with `values` in the order of `columns`. */
export function parseChoiceCsv(text: string, columns: readonly string[]): LongChoiceRow[] {
  let delimiter: CsvDelimiter;
  let records: CsvRecord[];
  try {
    ({ delimiter, records } = readCsvText(text, { trim: true, sameFieldCount: true }));
  } catch (error) {
    const line = (error as { lines?: number }).lines;
    throw new ChoiceDataError(`the CSV cannot be read: ${(error as Error).message}`, line);
  }
  if (records.length < 2)
    throw new ChoiceDataError('the CSV needs a header line and at least one data line');
  const header = records[0].record;
  // The spec's attribute columns by their exact name; the file's own columns in any case.
  const index = (name: string) => header.indexOf(name);
  const keyIndex = (name: string) => keyColumnIndex(header, name);
  for (const name of REQUIRED) {
    if (keyIndex(name) < 0)
      throw new ChoiceDataError(`the CSV header has no column "${name}"`, 1, name);
  }
  for (const name of columns) {
    if (index(name) < 0)
      throw new ChoiceDataError(
        `the CSV header has no column "${name}" named in the specification`,
        1,
        name,
      );
  }
  const holdoutAt = keyIndex('holdout');
  const includedAt = keyIndex('included');
  const at = columns.map(index);
  const [respondentAt, taskAt, altAt, chosenAt] = REQUIRED.map(keyIndex);
  const rows: LongChoiceRow[] = [];
  records.slice(1).forEach(({ record, line }) => {
    if (includedAt >= 0) {
      const included = record[includedAt].toLowerCase();
      if (included === 'false' || included === '0') return;
      if (included !== 'true' && included !== '1')
        throw new ChoiceDataError(
          `line ${line}: included must be true or false ("${record[includedAt]}")`,
          line,
          'included',
        );
    }
    const numberAt = (col: number, name: string): number => {
      const raw = record[col];
      const value = raw === '' ? NaN : Number(withDecimalPoint(raw, delimiter));
      if (!Number.isFinite(value))
        throw new ChoiceDataError(
          `line ${line}: column ${name} is not a number ("${raw}")`,
          line,
          name,
        );
      return value;
    };
    for (const [col, name] of [
      [respondentAt, 'respondent'],
      [taskAt, 'task'],
      [altAt, 'alt'],
    ] as const) {
      if (record[col] === '')
        throw new ChoiceDataError(`line ${line}: column ${name} is empty`, line, name);
    }
    const holdout = holdoutAt >= 0 ? numberAt(holdoutAt, 'holdout') : 0;
    if (holdout !== 0 && holdout !== 1)
      throw new ChoiceDataError(`line ${line}: holdout must be 0 or 1`, line, 'holdout');
    rows.push({
      respondent: record[respondentAt],
      task: record[taskAt],
      alt: record[altAt],
      chosen: numberAt(chosenAt, 'chosen'),
      holdout: holdout === 1,
      values: at.map((col, k) => numberAt(col, columns[k])),
      line,
    });
  });
  if (rows.length === 0)
    throw new ChoiceDataError('every data line has included=false: no respondent counts');
  return rows;
}
