/**
 * The study's long choice file: one row per alternative shown, for every respondent who
 * answered a choice task, whatever their status. Beside the estimator's columns (respondent,
 * task, alt, chosen, holdout and the coded columns) it says whether the respondent counts in
 * the analysis and why not (inclusion.ts), the order the task was shown in, the position of
 * each alternative on screen and the seconds spent on the task. `npm run estimate` reads it
 * and leaves the rows with included=false out.
 */
import { respondentPlanSchema } from '../../../shared/schemas/respondent';
import type { CellValue } from '../../lib/safe-csv';
import type { PreparedChoiceData } from '../choice-data-from-study';
import type { VersionInput } from '../estimation/code-answers';
import { describeCodedColumn } from './coded-column-docs';
import { col, type DocumentedTable } from './documented-table';
import {
  getInclusion,
  inclusionColumns,
  respondentColumns,
  type RespondentStatus,
} from './inclusion';

export interface LongFileRespondent {
  id: string;
  /** Stable respondent number (kept when others are erased). */
  number: number;
  versionId: string;
  status: RespondentStatus;
  included: boolean;
  exclusionReason: string | null;
  plan: unknown;
}

export interface LongFileAnswer {
  respondentId: string;
  screenKey: string;
  responseMs: number | null;
  /** The stored answer; a choice carries `certainty` when its task asked how sure. */
  value?: unknown;
}

/** The certainty answer (1 = least sure) stored with a choice, or null when none was asked. */
export function certaintyOf(value: unknown): number | null {
  const c = (value as { certainty?: unknown } | null)?.certainty;
  return typeof c === 'number' ? c : null;
}

/** The screen key of a long-row task id: design task n → task:n, holdout hk → its page. */
export function screenKeyOf(version: VersionInput | undefined, task: string | number): string {
  if (typeof task === 'number') return `task:${task}`;
  const k = Number(task.slice(1));
  return version?.holdouts[k - 1]?.screenKey ?? task;
}

export function buildLongChoiceTable(
  prepared: PreparedChoiceData,
  versions: readonly VersionInput[],
  respondents: readonly LongFileRespondent[],
  answers: readonly LongFileAnswer[],
): DocumentedTable {
  const latest = [...versions].sort((a, b) => b.version - a.version)[0];
  const number = new Map(respondents.map((r) => [r.id, r.number]));
  const byId = new Map(respondents.map((r) => [r.id, r]));
  const versionOf = new Map(versions.map((v) => [v.id, v]));
  const plans = new Map(
    respondents.map((r) => [r.id, respondentPlanSchema.safeParse(r.plan).data ?? null]),
  );
  const byScreen = new Map(answers.map((a) => [`${a.respondentId}|${a.screenKey}`, a]));
  const rows: CellValue[][] = prepared.rows.map((row) => {
    const id = String(row.respondent);
    const r = byId.get(id);
    const inclusion = r ? getInclusion(r) : { included: false, exclusion: 'unknown respondent' };
    const plan = plans.get(id);
    const screenKey = screenKeyOf(versionOf.get(r?.versionId ?? ''), row.task);
    const taskShown =
      typeof row.task === 'number' && plan ? plan.taskOrder.indexOf(row.task) + 1 || null : null;
    // The long rows number designed alternatives 1..J and the opt-out J+1; the plan -1.
    const order = plan?.positions[screenKey];
    const designIndex = Number(row.alt) - 1;
    const alternatives = order?.filter((j) => j >= 0).length ?? 0;
    const atPosition = order?.indexOf(designIndex >= alternatives ? -1 : designIndex) ?? -1;
    const answer = byScreen.get(`${id}|${screenKey}`);
    const time = answer?.responseMs;
    return [
      id,
      number.get(id) ?? null,
      inclusion.included,
      inclusion.exclusion,
      versionOf.get(r?.versionId ?? '')?.version ?? null,
      row.task,
      taskShown,
      row.alt,
      atPosition >= 0 ? atPosition + 1 : null,
      row.chosen,
      row.holdout ? 1 : 0,
      time === null || time === undefined ? null : time / 1000,
      certaintyOf(answer?.value),
      ...Array.from(row.values),
    ];
  });
  return {
    name: 'choices-long',
    columns: [
      ...respondentColumns,
      ...inclusionColumns,
      col(
        'version',
        'integer',
        'Study version the respondent answered; task numbers refer to that version’s design',
        'none',
        'integer from 1',
      ),
      col(
        'task',
        'text',
        'Design task number; h1, h2 … for holdout tasks',
        'none',
        'integer, or h<k>',
      ),
      col(
        'task_shown',
        'integer',
        'Place of the task in the order this respondent saw the design tasks',
        'none',
        '1 = shown first; empty for holdout tasks, whose place the questionnaire fixes',
      ),
      col(
        'alt',
        'integer',
        'Alternative as numbered in the design; the opt-out or status quo last',
        'none',
        '1..J, J+1 = opt-out / status quo',
      ),
      col(
        'alt_position',
        'integer',
        'Where the alternative stood on screen, left to right (top to bottom on phones)',
        'none',
        '1 = first; empty when the record holds no positions',
      ),
      col(
        'chosen',
        'integer',
        'Whether this alternative was chosen',
        'none',
        '1 = chosen, 0 = not',
      ),
      col(
        'holdout',
        'integer',
        'Whether the task is a holdout (kept out of estimation)',
        'none',
        '1 = holdout, 0 = design task',
      ),
      col(
        'task_seconds',
        'seconds',
        'Time the respondent spent on the task (the same on each of its rows)',
        'seconds',
        'number; empty when not recorded',
      ),
      col(
        'certainty',
        'integer',
        'How sure the respondent said they were of this choice (the same on each of its rows)',
        'none',
        '1 = least sure, up to the scale set on the tasks page; empty when not asked',
      ),
      ...prepared.columns.map((c) => describeCodedColumn(latest.definition, c)),
    ],
    rows,
  };
}
