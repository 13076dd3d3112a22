/**
 * Builds the typed-array choice data (see choice-data.ts) from long rows, checking that every
 * task has at least two alternatives and exactly one chosen, that alternatives are unique in
 * a task and that all values are finite; holdout tasks go to a separate data set.
 */
import { ChoiceDataError, type ChoiceData, type LongChoiceRow } from './choice-data';

export interface BuiltChoiceData {
  data: ChoiceData;
  /** Holdout tasks (same columns); null when no row is flagged holdout. */
  holdout: ChoiceData | null;
  /**
   * The estimation tasks with one dummy column per alternative identifier (the first one seen
   * is the reference): the constants-only model of LL(C). Null when there are more than
   * MAX_CONSTANTS identifiers (alternatives without a stable identity across tasks).
   */
  constants?: ChoiceData | null;
}

const MAX_CONSTANTS = 20;

interface TaskGroup {
  id: string;
  rows: LongChoiceRow[];
  lines: number[];
  holdout: boolean;
}

/**
 * Groups rows by respondent (first-seen order) and task, validates them, and lays them out.
 * Throws ChoiceDataError naming the line for the first problem found.
 */
export function buildChoiceData(
  columns: readonly string[],
  rows: readonly LongChoiceRow[],
): BuiltChoiceData {
  if (columns.length === 0)
    throw new ChoiceDataError('at least one attribute column is required', undefined, 'columns');
  if (rows.length === 0) throw new ChoiceDataError('the data has no rows');
  const respondents = new Map<string, Map<string, TaskGroup>>();
  rows.forEach((row, index) => {
    const line = row.line ?? index + 1;
    assertRowValid(row, line, columns);
    const rid = String(row.respondent);
    let tasks = respondents.get(rid);
    if (!tasks) respondents.set(rid, (tasks = new Map()));
    const tid = String(row.task);
    let group = tasks.get(tid);
    if (!group)
      tasks.set(tid, (group = { id: tid, rows: [], lines: [], holdout: Boolean(row.holdout) }));
    if (group.holdout !== Boolean(row.holdout)) {
      throw new ChoiceDataError(
        `line ${line}: task ${tid} of respondent ${rid} mixes holdout and estimation rows`,
        line,
        'holdout',
      );
    }
    if (group.rows.some((r) => String(r.alt) === String(row.alt))) {
      throw new ChoiceDataError(
        `line ${line}: alternative ${row.alt} appears twice in task ${tid} of respondent ${rid}`,
        line,
        'alt',
      );
    }
    group.rows.push(row);
    group.lines.push(line);
  });
  for (const [rid, tasks] of respondents)
    for (const group of tasks.values()) assertTaskValid(rid, group);
  const estimation = layOut(columns, respondents, false);
  if (!estimation)
    throw new ChoiceDataError('every task is flagged holdout; no tasks are left for estimation');
  return {
    data: estimation,
    holdout: layOut(columns, respondents, true),
    constants: layOutConstants(respondents),
  };
}

function layOutConstants(respondents: Map<string, Map<string, TaskGroup>>): ChoiceData | null {
  const ids: string[] = [];
  for (const tasks of respondents.values())
    for (const group of tasks.values())
      if (!group.holdout)
        for (const row of group.rows) if (!ids.includes(String(row.alt))) ids.push(String(row.alt));
  if (ids.length < 2 || ids.length > MAX_CONSTANTS + 1) return null;
  const columns = ids.slice(1).map((id) => `asc_${id}`);
  const rebuilt = new Map<string, Map<string, TaskGroup>>();
  for (const [rid, tasks] of respondents) {
    const copy = new Map<string, TaskGroup>();
    for (const [tid, group] of tasks)
      copy.set(tid, {
        ...group,
        rows: group.rows.map((row) => ({
          ...row,
          values: columns.map((_, c) => (String(row.alt) === ids[c + 1] ? 1 : 0)),
        })),
      });
    rebuilt.set(rid, copy);
  }
  return layOut(columns, rebuilt, false);
}

function assertRowValid(row: LongChoiceRow, line: number, columns: readonly string[]): void {
  if (row.chosen !== 0 && row.chosen !== 1) {
    throw new ChoiceDataError(
      `line ${line}: chosen must be 0 or 1, got ${row.chosen}`,
      line,
      'chosen',
    );
  }
  if (row.values.length !== columns.length) {
    throw new ChoiceDataError(
      `line ${line}: expected ${columns.length} attribute values, got ${row.values.length}`,
      line,
    );
  }
  for (let k = 0; k < columns.length; k++) {
    if (!Number.isFinite(row.values[k])) {
      throw new ChoiceDataError(
        `line ${line}: column ${columns[k]} is not a finite number`,
        line,
        columns[k],
      );
    }
  }
}

function assertTaskValid(rid: string, group: TaskGroup): void {
  const chosen = group.rows.filter((r) => r.chosen === 1).length;
  const where = `task ${group.id} of respondent ${rid} (line ${group.lines[0]})`;
  if (group.rows.length < 2)
    throw new ChoiceDataError(`${where} has only one alternative`, group.lines[0], 'alt');
  if (chosen === 0)
    throw new ChoiceDataError(`${where} has no chosen alternative`, group.lines[0], 'chosen');
  if (chosen > 1)
    throw new ChoiceDataError(
      `${where} has ${chosen} chosen alternatives`,
      group.lines[0],
      'chosen',
    );
}

function layOut(
  columns: readonly string[],
  respondents: Map<string, Map<string, TaskGroup>>,
  holdout: boolean,
): ChoiceData | null {
  const K = columns.length;
  const respondentIds: string[] = [];
  const taskIds: string[] = [];
  const taskStart: number[] = [0];
  const diffStart: number[] = [0];
  const altCount: number[] = [];
  const diffs: number[] = [];
  for (const [rid, tasks] of respondents) {
    const selected = [...tasks.values()].filter((g) => g.holdout === holdout);
    if (selected.length === 0) continue;
    respondentIds.push(rid);
    for (const group of selected) {
      const chosen = group.rows.find((r) => r.chosen === 1)!;
      for (const row of group.rows) {
        if (row === chosen) continue;
        for (let k = 0; k < K; k++) diffs.push(row.values[k] - chosen.values[k]);
      }
      taskIds.push(group.id);
      altCount.push(group.rows.length);
      diffStart.push(diffStart[diffStart.length - 1] + group.rows.length - 1);
    }
    taskStart.push(taskIds.length);
  }
  if (respondentIds.length === 0) return null;
  return {
    columns: [...columns],
    respondentIds,
    taskIds,
    taskStart: Int32Array.from(taskStart),
    diffStart: Int32Array.from(diffStart),
    diffs: Float64Array.from(diffs),
    altCount: Int32Array.from(altCount),
  };
}
