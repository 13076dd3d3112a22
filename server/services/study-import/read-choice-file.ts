/**
 * Reads a long-format choice file as a stream (csv-parse), one row per alternative with the
 * columns the command-line estimator reads (respondent, task, alt, chosen) and one column per
 * attribute holding the level as text or number. Rows are kept as small integer codes
 * (column-dictionary.ts) and chained per task, so a million rows need a few arrays of numbers.
 * Row-level problems found while reading (wrong field count, empty keys, chosen not 0/1,
 * duplicate rows) are reported with line and column; task- and respondent-level checks run
 * afterwards (choice-file-checks.ts).
 */
import type { Readable } from 'node:stream';
import { keyColumnIndex } from '../../lib/csv-dialect';
import { readCsvRecords } from './csv-records';
import {
  choiceFileKeyColumns,
  choiceFileUnsupportedColumns,
  IMPORT_MAX_ROWS,
} from '../../../shared/schemas/study-import';
import { ColumnDictionary } from './column-dictionary';
import { ProblemList } from './problem-list';

export interface ChoiceFileScan {
  header: string[];
  /** Columns other than the key columns: candidate attributes. */
  columns: ColumnDictionary[];
  rows: number;
  /** Respondent ids as the file writes them, in order of first appearance. */
  respondents: string[];
  /** Per row: its line, task index, alternative code and chosen flag. */
  rowLine: number[];
  rowTask: number[];
  rowAlt: number[];
  rowChosen: number[];
  /** Per row: the previous row of the same task (−1 at the first), so a task's rows chain. */
  rowPrevInTask: number[];
  /** Per task (respondent and task id): its respondent index, task id, first line, last row. */
  taskRespondent: number[];
  taskId: string[];
  taskFirstLine: number[];
  taskLastRow: number[];
  /** Alternative ids as written, by code. */
  alternatives: string[];
  problems: ProblemList;
  /** False when the header lacks a key column (nothing else was read). */
  readable: boolean;
}

/** Scans the file; never throws on bad content (everything becomes a problem). */
export async function readChoiceFile(input: Readable): Promise<ChoiceFileScan> {
  const scan = emptyScan();
  const problems = scan.problems;
  const respondentIndex = new Map<string, number>();
  const taskIndex = new Map<string, number>();
  const altIndex = new Map<string, number>();
  let keyAt: number[] = [];
  let attributeAt: number[] = [];
  try {
    await readCsvRecords(input, (record, line) => {
      if (scan.header.length === 0) {
        scan.header = record;
        keyAt = choiceFileKeyColumns.map((name) => keyColumnIndex(record, name));
        choiceFileKeyColumns.forEach((name, k) => {
          if (keyAt[k] < 0)
            problems.add({
              file: 'choices',
              line: 1,
              column: name,
              code: 'missing_column',
              message: `The header has no column “${name}” (the columns are respondent, task, alt, chosen, then one per attribute).`,
            });
        });
        for (const name of choiceFileUnsupportedColumns)
          if (keyColumnIndex(record, name) >= 0)
            problems.add({
              file: 'choices',
              line: 1,
              column: name,
              code: 'unsupported_column',
              message: `Remove the column “${name}”: every imported task is an estimation task and every respondent counts.`,
            });
        if (keyAt.some((i) => i < 0)) {
          scan.readable = false;
          return false;
        }
        attributeAt = record.map((_, i) => i).filter((i) => !keyAt.includes(i));
        scan.columns = attributeAt.map((i) => new ColumnDictionary(record[i]));
        return;
      }
      if (record.length !== scan.header.length) {
        problems.add({
          file: 'choices',
          line,
          column: null,
          code: 'field_count',
          message: `This line has ${record.length} fields; the header has ${scan.header.length}.`,
        });
        return;
      }
      const [respondent, task, alt, chosen] = keyAt.map((i) => record[i]);
      const emptyKey = choiceFileKeyColumns.find((_, k) => record[keyAt[k]] === '');
      if (emptyKey) {
        problems.add({
          file: 'choices',
          line,
          column: emptyKey,
          code: 'empty_key',
          message: `The ${emptyKey} column is empty.`,
        });
        return;
      }
      if (scan.rows >= IMPORT_MAX_ROWS) {
        problems.add({
          file: 'choices',
          line,
          column: null,
          code: 'too_many_rows',
          message: `The file has more than ${IMPORT_MAX_ROWS.toLocaleString('en')} data lines; split it by respondent.`,
        });
        return false;
      }
      const r = indexOfValue(respondentIndex, scan.respondents, respondent);
      const taskKey = `${r}\u0000${task}`;
      let t = taskIndex.get(taskKey);
      if (t === undefined) {
        t = scan.taskId.length;
        taskIndex.set(taskKey, t);
        scan.taskRespondent.push(r);
        scan.taskId.push(task);
        scan.taskFirstLine.push(line);
        scan.taskLastRow.push(-1);
      }
      const a = indexOfValue(altIndex, scan.alternatives, alt);
      const duplicateOf = findAlternative(scan, scan.taskLastRow[t], a);
      if (duplicateOf >= 0) {
        problems.add({
          file: 'choices',
          line,
          column: 'alt',
          code: 'duplicate_row',
          message: `Respondent ${respondent}, task ${task}, alternative ${alt} already appears on line ${scan.rowLine[duplicateOf]}.`,
        });
        return;
      }
      if (chosen !== '0' && chosen !== '1')
        problems.add({
          file: 'choices',
          line,
          column: 'chosen',
          code: 'chosen_not_binary',
          message: `chosen must be 1 (chosen) or 0 (not chosen), not “${chosen}”.`,
        });
      const row = scan.rows++;
      scan.rowLine.push(line);
      scan.rowTask.push(t);
      scan.rowAlt.push(a);
      scan.rowChosen.push(chosen === '1' ? 1 : 0);
      scan.rowPrevInTask.push(scan.taskLastRow[t]);
      scan.taskLastRow[t] = row;
      attributeAt.forEach((at, k) => scan.columns[k].push(record[at], line));
    });
  } catch (error) {
    problems.add({
      file: 'choices',
      line: null,
      column: null,
      code: 'unreadable',
      message: `The file cannot be read as CSV: ${(error as Error).message}`,
    });
    scan.readable = false;
  } finally {
    input.destroy();
  }
  if (scan.header.length === 0) {
    scan.readable = false;
    problems.add({
      file: 'choices',
      line: null,
      column: null,
      code: 'unreadable',
      message: 'The file is empty: it needs a header line and data lines.',
    });
  }
  return scan;
}

/** The row of the task (chain ending at `last`) with alternative code `alt`, or −1. */
/** The index of `value` in `values`, appending it (and noting it in `index`) when new. */
function indexOfValue(index: Map<string, number>, values: string[], value: string): number {
  let i = index.get(value);
  if (i === undefined) {
    i = values.length;
    index.set(value, i);
    values.push(value);
  }
  return i;
}

function findAlternative(scan: ChoiceFileScan, last: number, alt: number): number {
  for (let row = last, steps = 0; row >= 0 && steps < 50; row = scan.rowPrevInTask[row], steps++)
    if (scan.rowAlt[row] === alt) return row;
  return -1;
}

function emptyScan(): ChoiceFileScan {
  return {
    header: [],
    columns: [],
    rows: 0,
    respondents: [],
    rowLine: [],
    rowTask: [],
    rowAlt: [],
    rowChosen: [],
    rowPrevInTask: [],
    taskRespondent: [],
    taskId: [],
    taskFirstLine: [],
    taskLastRow: [],
    alternatives: [],
    problems: new ProblemList(),
    readable: true,
  };
}
