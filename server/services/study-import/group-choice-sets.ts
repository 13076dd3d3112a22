/**
 * Turns the file's tasks into the study's shape: every distinct choice set (the alternatives of
 * a task, ordered by their alt id, with the level of every attribute) becomes one task of the
 * imported design, and each respondent's task points at its set with the position chosen. A
 * respondent who saw the same set twice (a repeated task) gets a second copy, since a
 * respondent answers each design task once.
 */
import { IMPORT_MAX_CHOICE_SETS, type ImportProblem } from '../../../shared/schemas/study-import';
import { readNumber } from './column-dictionary';
import type { MatchedAttribute } from './match-levels';
import type { ChoiceFileScan } from './read-choice-file';

export interface GroupedChoiceSets {
  /** sets[s][j][a]: level index of attribute a in alternative j of set s. */
  sets: number[][][];
  /** Per file task: its set (−1 when its levels could not all be matched) and chosen position. */
  taskSet: Int32Array;
  taskChosen: Int32Array;
}

/** Order of the alternative ids: numerically when they are all numbers, else as text. */
function alternativeRanks(ids: readonly string[]): Int32Array {
  const numbers = ids.map(readNumber);
  const numeric = numbers.every((x) => x !== null);
  const order = ids
    .map((_, i) => i)
    .sort((a, b) =>
      numeric ? numbers[a]! - numbers[b]! : ids[a] < ids[b] ? -1 : ids[a] > ids[b] ? 1 : 0,
    );
  const rank = new Int32Array(ids.length);
  order.forEach((code, r) => (rank[code] = r));
  return rank;
}

export function groupChoiceSets(
  scan: ChoiceFileScan,
  matched: readonly MatchedAttribute[],
): GroupedChoiceSets {
  const tasks = scan.taskId.length;
  const taskSet = new Int32Array(tasks).fill(-1);
  const taskChosen = new Int32Array(tasks).fill(-1);
  const sets: number[][][] = [];
  const setOfKey = new Map<string, number>();
  const seenByRespondent = new Map<string, number>();
  const rank = alternativeRanks(scan.alternatives);
  const rows: number[] = [];
  let full: ImportProblem | null = null;
  for (let t = 0; t < tasks && !full; t++) {
    rows.length = 0;
    for (let row = scan.taskLastRow[t]; row >= 0; row = scan.rowPrevInTask[row]) rows.push(row);
    rows.sort((a, b) => rank[scan.rowAlt[a]] - rank[scan.rowAlt[b]]);
    const levels: number[][] = [];
    let complete = true;
    for (const row of rows) {
      const alternative = matched.map((m) => {
        const code = scan.columns[m.columnIndex].codes[row];
        return code >= 0 ? m.levelOfCode[code] : -1;
      });
      if (alternative.includes(-1)) complete = false;
      levels.push(alternative);
    }
    if (!complete) continue;
    const key = levels.map((l) => l.join(',')).join('|');
    const mine = `${scan.taskRespondent[t]}\u0000${key}`;
    const repeat = seenByRespondent.get(mine) ?? 0;
    seenByRespondent.set(mine, repeat + 1);
    const setKey = `${repeat}\u0000${key}`;
    let s = setOfKey.get(setKey);
    if (s === undefined) {
      if (sets.length >= IMPORT_MAX_CHOICE_SETS) {
        full = {
          file: 'choices',
          line: scan.taskFirstLine[t],
          column: null,
          code: 'too_many_choice_sets',
          message: `The file holds more than ${IMPORT_MAX_CHOICE_SETS.toLocaleString('en')} different choice sets (from this line on); a study stores each set once, so split the file or leave an attribute out.`,
        };
        break;
      }
      s = sets.length;
      setOfKey.set(setKey, s);
      sets.push(levels);
    }
    taskSet[t] = s;
    taskChosen[t] = rows.findIndex((row) => scan.rowChosen[row] === 1);
  }
  if (full) scan.problems.add(full);
  return { sets, taskSet, taskChosen };
}
