/**
 * The long format shared by the command-line estimator (scripts/estimate.ts), the exports and
 * the data hash of a run: `respondent,task,alt,chosen,holdout` then one column per coded
 * column, headed by its code. A run's data hash is the SHA-256 of exactly this CSV restricted
 * to the columns the run used, so an analyst can check an export against a run.
 */
import { createHash } from 'node:crypto';
import { writeCsv, writeCsvRecords } from '../../lib/safe-csv';
import { buildChoiceData, type BuiltChoiceData } from '../../engine/estimation/build-choice-data';
import type { LongChoiceRow } from '../../engine/estimation/choice-data';
import type { PreparedChoiceData } from './code-answers';
import { StudyDataError } from './study-data-error';

export interface LongCsvTable {
  header: string[];
  rows: (string | number)[][];
}

/** Indexes of the given column keys (all columns when omitted); throws on an unknown key. */
function columnIndexes(prepared: PreparedChoiceData, keys?: readonly string[]): number[] {
  if (!keys) return prepared.columns.map((_, i) => i);
  return keys.map((key) => {
    const i = prepared.columns.findIndex((c) => c.key === key);
    if (i < 0) throw new StudyDataError('no_data', `The study has no coded column ${key}.`);
    return i;
  });
}

/** Header and rows of the long-format CSV (numbers kept as numbers). */
export function toLongCsvRows(
  prepared: PreparedChoiceData,
  keys?: readonly string[],
): LongCsvTable {
  const at = columnIndexes(prepared, keys);
  return {
    header: [
      'respondent',
      'task',
      'alt',
      'chosen',
      'holdout',
      ...at.map((i) => prepared.columns[i].code),
    ],
    rows: prepared.rows.map((r) => [
      String(r.respondent),
      r.task,
      r.alt,
      r.chosen,
      r.holdout ? 1 : 0,
      ...at.map((i) => r.values[i]),
    ]),
  };
}

/** The long-format CSV text (what `npm run estimate -- --data` reads). */
export function toLongCsvText(prepared: PreparedChoiceData, keys?: readonly string[]): string {
  const table = toLongCsvRows(prepared, keys);
  return writeCsv(table.header, table.rows);
}

/**
 * Rows the data hash writes and digests at a time. A CSV document is its records one after
 * the other, each ending in its own line break, so the slices written apart and digested in
 * order give the bytes, and the hash, of the whole document.
 */
export const HASH_SLICE_ROWS = 2_000;

/** The long CSV of the given columns in slices of HASH_SLICE_ROWS rows (the header first). */
function* longCsvSlices(prepared: PreparedChoiceData, keys?: readonly string[]) {
  const table = toLongCsvRows(prepared, keys);
  yield writeCsvRecords([table.header]);
  for (let at = 0; at < table.rows.length; at += HASH_SLICE_ROWS)
    yield writeCsvRecords(table.rows.slice(at, at + HASH_SLICE_ROWS));
}

/** SHA-256 (hex) of the long CSV of the given columns. */
export function hashChoiceData(prepared: PreparedChoiceData, keys?: readonly string[]): string {
  return createHash('sha256').update(toLongCsvText(prepared, keys)).digest('hex');
}

/**
 * hashChoiceData for the estimation job on the web process's thread (embedded worker): it lets
 * the event loop turn between slices, so a large study's hash does not hold up respondents'
 * requests for its whole length (the demo's took one block of about 200 ms in a
 * bench:fieldwork profile). Same bytes, same hash.
 */
export async function hashChoiceDataInTurns(
  prepared: PreparedChoiceData,
  keys?: readonly string[],
): Promise<string> {
  const hash = createHash('sha256');
  for (const slice of longCsvSlices(prepared, keys)) {
    hash.update(slice);
    await new Promise<void>((resolve) => setImmediate(resolve));
  }
  return hash.digest('hex');
}

/** The engine's typed-array data for the given column keys (estimation and holdout parts). */
export function toBuiltChoiceData(
  prepared: PreparedChoiceData,
  keys: readonly string[],
): BuiltChoiceData {
  const at = columnIndexes(prepared, keys);
  if (prepared.summary.tasks === 0)
    throw new StudyDataError(
      'no_estimation_tasks',
      'No included respondent has answered a choice task that counts for estimation.',
    );
  const rows: LongChoiceRow[] = prepared.rows.map((r) => ({
    ...r,
    values: at.map((i) => r.values[i]),
  }));
  return buildChoiceData(keys, rows);
}
