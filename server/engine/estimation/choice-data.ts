/**
 * Choice data laid out for the likelihood's inner loop. Respondent n owns tasks
 * taskStart[n]..taskStart[n+1]−1; task t owns the rows diffStart[t]..diffStart[t+1]−1 of
 * `diffs`, one per NON-chosen alternative, holding x_j − x_chosen (K columns). With these
 * differences the logit probability of the observed choice is 1 / (1 + Σ_j exp(β·d_j))
 * (Train 2009, eq. 3.6 rearranged), so the chosen alternative never needs its own row and
 * tasks may have different numbers of alternatives.
 */
export interface ChoiceData {
  /** Names of the K attribute columns, in column order. */
  readonly columns: readonly string[];
  /** Respondent identifiers as they appeared in the input, in first-seen order. */
  readonly respondentIds: readonly string[];
  /** Task identifiers (one per task, in layout order). */
  readonly taskIds: readonly string[];
  /** Length N+1: tasks of respondent n are taskStart[n] .. taskStart[n+1]−1. */
  readonly taskStart: Int32Array;
  /** Length T+1: difference rows of task t are diffStart[t] .. diffStart[t+1]−1. */
  readonly diffStart: Int32Array;
  /** (number of non-chosen alternatives overall) × K, row-major: x_j − x_chosen. */
  readonly diffs: Float64Array;
  /** Number of alternatives shown in each task (chosen one included). */
  readonly altCount: Int32Array;
}

/** Most difference rows of one task (at least 1): the length of per-task scratch arrays. */
export function getMaxTaskRows(data: Pick<ChoiceData, 'diffStart'>): number {
  let maxRows = 1;
  for (let t = 0; t + 1 < data.diffStart.length; t++)
    maxRows = Math.max(maxRows, data.diffStart[t + 1] - data.diffStart[t]);
  return maxRows;
}

/** Most difference rows of one respondent among first..first+count−1 (at least 1). */
export function getMaxRespondentRows(
  data: Pick<ChoiceData, 'diffStart' | 'taskStart'>,
  first: number,
  count: number,
): number {
  let maxRows = 1;
  for (let n = first; n < first + count; n++) {
    const rows = data.diffStart[data.taskStart[n + 1]] - data.diffStart[data.taskStart[n]];
    if (rows > maxRows) maxRows = rows;
  }
  return maxRows;
}

/** One input row in long format: one alternative of one task. */
export interface LongChoiceRow {
  respondent: string | number;
  task: string | number;
  alt: string | number;
  /** 1 for the chosen alternative, 0 otherwise. */
  chosen: number;
  /** Tasks flagged holdout are kept apart for the holdout hit rate. */
  holdout?: boolean;
  /** Attribute values in the order of `columns`. */
  values: ArrayLike<number>;
  /** 1-based line number shown in error messages (defaults to the row's position + 1). */
  line?: number;
}

/** Error raised for invalid choice data; names the offending line and field. */
export class ChoiceDataError extends Error {
  readonly line: number | undefined;
  readonly field: string | undefined;
  constructor(message: string, line?: number, field?: string) {
    super(message);
    this.name = 'ChoiceDataError';
    this.line = line;
    this.field = field;
  }
}
