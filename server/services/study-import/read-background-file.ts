/**
 * The optional second file: one line per respondent, a `respondent` column with the ids of the
 * choice file, and one column per background question. A column whose values are all numbers
 * becomes a number question, any other a single-choice question with its values as options
 * (at most 30). Empty cells are unanswered. Respondents missing from the choice file and
 * respondents given twice are problems with their line.
 */
import type { Readable } from 'node:stream';
import { keyColumnIndex } from '../../lib/csv-dialect';
import { readCsvRecords } from './csv-records';
import { questionKeyFromText } from '../../../shared/schemas/question-keys';
import type {
  ImportBackgroundColumn,
  ImportProblemCode,
} from '../../../shared/schemas/study-import';
import { readNumber } from './column-dictionary';
import type { ProblemList } from './problem-list';

const MAX_OPTIONS = 30;

export interface BackgroundColumn extends ImportBackgroundColumn {
  /** Distinct values (single-choice options), in order of appearance. */
  options: string[];
  min: number;
  max: number;
  integer: boolean;
}

export interface BackgroundScan {
  columns: BackgroundColumn[];
  /** Respondent index (in the choice file) → raw value per column ('' unanswered). */
  answers: Map<number, string[]>;
}

export async function readBackgroundFile(
  input: Readable,
  respondentIndex: ReadonlyMap<string, number>,
  problems: ProblemList,
): Promise<BackgroundScan> {
  const answers = new Map<number, string[]>();
  let header: string[] = [];
  let respondentAt = -1;
  const add = (
    line: number | null,
    column: string | null,
    code: ImportProblemCode,
    message: string,
  ) => problems.add({ file: 'background', line, column, code, message });
  try {
    await readCsvRecords(input, (record, line) => {
      if (header.length === 0) {
        header = record;
        respondentAt = keyColumnIndex(header, 'respondent');
        if (respondentAt < 0) {
          add(1, 'respondent', 'missing_column', 'The header has no column “respondent”.');
          return false;
        }
        return;
      }
      if (record.length !== header.length) {
        add(
          line,
          null,
          'field_count',
          `This line has ${record.length} fields; the header has ${header.length}.`,
        );
        return;
      }
      const id = record[respondentAt];
      const r = respondentIndex.get(id);
      if (r === undefined) {
        add(
          line,
          'respondent',
          'background_unknown_respondent',
          `Respondent “${id}” has no choices in the choice file.`,
        );
        return;
      }
      if (answers.has(r)) {
        add(
          line,
          'respondent',
          'background_duplicate_respondent',
          `Respondent ${id} appears on an earlier line too.`,
        );
        return;
      }
      answers.set(
        r,
        record.filter((_, i) => i !== respondentAt),
      );
    });
  } catch (error) {
    add(null, null, 'unreadable', `The file cannot be read as CSV: ${(error as Error).message}`);
  } finally {
    input.destroy();
  }
  const names = header.filter((_, i) => i !== respondentAt);
  const taken: string[] = [];
  const columns = names.map((name, k) => {
    const values = [...answers.values()].map((a) => a[k]).filter((v) => v !== '');
    const numbers = values.map(readNumber);
    const numeric = values.length > 0 && numbers.every((x) => x !== null);
    const options = numeric ? [] : [...new Set(values)];
    if (options.length > MAX_OPTIONS)
      add(
        1,
        name,
        'too_many_levels',
        `${name} has ${options.length} different answers; a single-choice question has at most ${MAX_OPTIONS}.`,
      );
    const key = questionKeyFromText(name, taken);
    taken.push(key);
    const xs = numbers as number[];
    return {
      column: name,
      key,
      text: name,
      type: numeric ? ('number' as const) : ('single' as const),
      options: options.slice(0, MAX_OPTIONS),
      min: numeric ? xs.reduce((a, b) => Math.min(a, b)) : 0,
      max: numeric ? xs.reduce((a, b) => Math.max(a, b)) : 0,
      integer: numeric && xs.every(Number.isInteger),
    };
  });
  return { columns, answers };
}
