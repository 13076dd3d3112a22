/**
 * Checks that need the whole choice file: each task has exactly one chosen alternative and
 * the same number of alternatives as the others, and each respondent fills an attribute
 * column on all of their rows or (when the column does not apply to anybody) on none. Every
 * problem names the line and column to look at.
 */
import { BLANK } from './column-dictionary';
import type { ChoiceFileScan } from './read-choice-file';

/** Adds task problems and returns the usual number of alternatives per task (the mode). */
export function checkTasks(scan: ChoiceFileScan): number {
  const tasks = scan.taskId.length;
  const altCount = new Int32Array(tasks);
  const chosenCount = new Int32Array(tasks);
  for (let row = 0; row < scan.rows; row++) {
    const t = scan.rowTask[row];
    altCount[t]++;
    chosenCount[t] += scan.rowChosen[row];
  }
  const frequency = new Map<number, number>();
  for (let t = 0; t < tasks; t++) frequency.set(altCount[t], (frequency.get(altCount[t]) ?? 0) + 1);
  let usual = 0;
  for (const [count, n] of frequency)
    if (n > (frequency.get(usual) ?? 0) || (n === frequency.get(usual) && count > usual))
      usual = count;
  const where = (t: number) =>
    `Respondent ${scan.respondents[scan.taskRespondent[t]]}, task ${scan.taskId[t]}`;
  for (let t = 0; t < tasks; t++) {
    if (altCount[t] === 0) continue;
    if (chosenCount[t] !== 1)
      scan.problems.add({
        file: 'choices',
        line: scan.taskFirstLine[t],
        column: 'chosen',
        code: 'chosen_count',
        message:
          chosenCount[t] === 0
            ? `${where(t)}: no alternative is chosen (one row of each task has chosen = 1).`
            : `${where(t)}: ${chosenCount[t]} alternatives are chosen (one row of each task has chosen = 1).`,
      });
    if (altCount[t] !== usual)
      scan.problems.add({
        file: 'choices',
        line: scan.taskFirstLine[t],
        column: 'alt',
        code: 'alternative_count',
        message: `${where(t)} has ${altCount[t]} alternatives; the other tasks have ${usual}.`,
      });
  }
  if (tasks > 0 && (usual < 2 || usual > 5))
    scan.problems.add({
      file: 'choices',
      line: null,
      column: 'alt',
      code: 'alternative_count',
      message: `Tasks have ${usual} alternatives; a study shows 2 to 5 per task.`,
    });
  return usual;
}

/**
 * Adds a problem for each respondent whose rows fill column `k` only partly (the first empty
 * line), or not at all while other respondents fill it (their first line).
 */
export function checkRespondentColumns(scan: ChoiceFileScan, columnIndexes: number[]): void {
  const n = scan.respondents.length;
  const rows = new Int32Array(n);
  const firstLine = new Int32Array(n);
  for (let row = 0; row < scan.rows; row++) {
    const r = scan.taskRespondent[scan.rowTask[row]];
    if (rows[r]++ === 0) firstLine[r] = scan.rowLine[row];
  }
  for (const k of columnIndexes) {
    const column = scan.columns[k];
    if (column.blanks === 0) continue;
    const blanks = new Int32Array(n);
    const firstBlank = new Int32Array(n);
    const codes = column.codes;
    for (let row = 0; row < scan.rows; row++) {
      if (codes[row] !== BLANK) continue;
      const r = scan.taskRespondent[scan.rowTask[row]];
      if (blanks[r]++ === 0) firstBlank[r] = scan.rowLine[row];
    }
    for (let r = 0; r < n; r++) {
      if (blanks[r] === 0) continue;
      const partly = blanks[r] < rows[r];
      scan.problems.add({
        file: 'choices',
        line: partly ? firstBlank[r] : firstLine[r],
        column: column.name,
        code: 'inconsistent_attributes',
        message: partly
          ? `Respondent ${scan.respondents[r]} has no ${column.name} on this line but has one on other lines.`
          : `Respondent ${scan.respondents[r]} has no ${column.name} on any line, while other respondents have one.`,
      });
    }
  }
}
