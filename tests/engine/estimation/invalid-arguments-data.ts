/** The small long-format rows the invalid-argument tests build their bad and good data from. */
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import type { LongChoiceRow } from '../../../server/engine/estimation/choice-data';

export const row = (
  respondent: number,
  task: number,
  alt: number,
  chosen: number,
  values: number[],
  holdout = false,
): LongChoiceRow => ({
  respondent,
  task,
  alt,
  chosen,
  values,
  holdout,
});

/** A two-alternative task whose first alternative is chosen. */
export const pair = (
  respondent: number,
  task: number,
  a: number[],
  b: number[],
): LongChoiceRow[] => [row(respondent, task, 1, 1, a), row(respondent, task, 2, 0, b)];

/** Valid data: two respondents, three tasks, two columns. */
export const good = buildChoiceData(
  ['x', 'z'],
  [...pair(1, 1, [1, 0], [0, 1]), ...pair(1, 2, [0, 1], [2, 0]), ...pair(2, 1, [1, 1], [0, 0])],
).data;
