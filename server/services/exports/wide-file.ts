/**
 * The wide respondent file: one row per respondent (every status), with inclusion, times,
 * each choice task in the order shown (design task, alternative chosen, its screen position,
 * seconds), holdout choices and the background answers this role may read. Written to open
 * directly in statistics packages; r-import-script.ts writes the R script that types it.
 */
import { respondentPlanSchema } from '../../../shared/schemas/respondent';
import type { TasteQuestion } from '../../../shared/schemas/tastes';
import type { CellValue } from '../../lib/safe-csv';
import type { VersionInput } from '../estimation/code-answers';
import { formatAnswer, getSkippedFlag, skippedColumnKey } from '../tastes/background-answers';
import { getFlagNames } from '../tastes/taste-rows';
import { col, type ColumnDoc, type DocumentedTable } from './documented-table';
import { certaintyOf } from './long-choice-file';
import {
  getInclusion,
  inclusionColumns,
  respondentColumns,
  type RespondentStatus,
} from './inclusion';

export const STATUS_LEVELS: readonly RespondentStatus[] = [
  'in_progress',
  'completed',
  'screened_out',
  'over_quota',
];

export interface WideRespondent {
  id: string;
  /** Stable respondent number (kept when others are erased). */
  number: number;
  externalId: string | null;
  versionId: string;
  block: number;
  status: RespondentStatus;
  included: boolean;
  exclusionReason: string | null;
  flags: unknown;
  startedAt: Date;
  finishedAt: Date | null;
  durationMs: number | null;
  plan: unknown;
}

export interface WideChoiceAnswer {
  respondentId: string;
  screenKey: string;
  chosenAlternative: number | null;
  chosenPosition: number | null;
  responseMs: number | null;
  /** The stored answer; a choice carries `certainty` when its task asked how sure. */
  value?: unknown;
}

export interface WideInput {
  versions: readonly VersionInput[];
  respondents: readonly WideRespondent[];
  choices: readonly WideChoiceAnswer[];
  questions: readonly TasteQuestion[];
  answers: Map<string, Map<string, unknown>>;
  personal: boolean;
}

const seconds = (ms: number | null | undefined) =>
  ms === null || ms === undefined ? null : ms / 1000;
/** Design alternatives 1..J; the opt-out or status quo (stored as −1) is 0. */
const choiceCode = (j: number | null | undefined) =>
  j === null || j === undefined ? null : j < 0 ? 0 : j + 1;

function questionColumn(q: TasteQuestion): ColumnDoc {
  const key = `q_${q.key}`;
  if (q.type === 'number') return col(key, 'estimate', `Answer to "${q.text}"`, 'as asked');
  if (q.type === 'single')
    return {
      ...col(
        key,
        'text',
        `Answer to "${q.text}"`,
        'none',
        'one of the levels, in the order offered',
      ),
      levels: q.options.map((o) => o.label),
    };
  return col(
    key,
    'text',
    `Answer to "${q.text}"`,
    'none',
    q.type === 'multiple' ? 'chosen options joined by "; "' : 'free text (personal data)',
  );
}

export function buildWideTable(input: WideInput): DocumentedTable {
  const plans = new Map(
    input.respondents.map((r) => [r.id, respondentPlanSchema.safeParse(r.plan).data ?? null]),
  );
  const tasks = Math.max(0, ...[...plans.values()].map((p) => p?.taskOrder.length ?? 0));
  const holdouts = Math.max(0, ...input.versions.map((v) => v.holdouts.length));
  const versionNumber = new Map(input.versions.map((v) => [v.id, v]));
  const choiceOf = new Map(input.choices.map((c) => [`${c.respondentId}|${c.screenKey}`, c]));
  const taskNumbers = Array.from({ length: tasks }, (_, i) => i + 1);
  const holdoutNumbers = Array.from({ length: holdouts }, (_, i) => i + 1);
  // Certainty columns only when some version's tasks asked how sure (the long file has it too).
  const asksCertainty = input.choices.some((c) => certaintyOf(c.value) !== null);

  const columns: ColumnDoc[] = [
    ...respondentColumns,
    ...(input.personal ? [col('external_id', 'text', 'External or panel id (personal data)')] : []),
    col('version', 'integer', 'Study version the respondent answered', 'none', 'integer from 1'),
    col('block', 'integer', 'Design block', 'none', 'integer from 1'),
    {
      ...col('status', 'text', 'Fieldwork status', 'none', STATUS_LEVELS.join(', ')),
      levels: STATUS_LEVELS,
    },
    ...inclusionColumns,
    col('started_at', 'text', 'When the respondent started', 'date-time, UTC', 'ISO 8601'),
    col(
      'finished_at',
      'text',
      'When the respondent finished; empty if not',
      'date-time, UTC',
      'ISO 8601',
    ),
    col('duration_seconds', 'seconds', 'Time from start to finish', 'seconds'),
    col(
      'quality_flags',
      'text',
      'Automatic quality flags',
      'none',
      'flag names joined by "; "; empty when none',
    ),
    ...taskNumbers.flatMap((k) => [
      col(
        `task_${k}`,
        'integer',
        `Design task shown in place ${k} of this respondent's order`,
        'none',
        'design task number',
      ),
      col(
        `choice_${k}`,
        'integer',
        `Alternative chosen in task_${k}`,
        'none',
        '1..J as numbered in the design, 0 = opt-out / status quo; empty = not answered',
      ),
      col(
        `position_${k}`,
        'integer',
        `Screen position of the alternative chosen in task_${k}`,
        'none',
        '1 = first (left, or top on phones)',
      ),
      col(`seconds_${k}`, 'seconds', `Time spent on task_${k}`, 'seconds'),
      ...(asksCertainty
        ? [
            col(
              `certainty_${k}`,
              'integer',
              `How sure the respondent said they were of the choice in task_${k}`,
              'none',
              '1 = least sure, up to the scale set on the tasks page; empty when not asked',
            ),
          ]
        : []),
    ]),
    ...holdoutNumbers.flatMap((h) => [
      col(
        `holdout_${h}_choice`,
        'integer',
        `Alternative chosen in holdout task ${h}`,
        'none',
        '1..J as set in the questionnaire, 0 = opt-out / status quo',
      ),
      col(`holdout_${h}_seconds`, 'seconds', `Time spent on holdout task ${h}`, 'seconds'),
    ]),
    ...input.questions.flatMap((q) => [
      questionColumn(q),
      ...(q.conditional
        ? [
            col(
              skippedColumnKey(`q_${q.key}`),
              'integer',
              `Whether the page of "${q.text}" was passed by its skip rule`,
              'none',
              '1 = the page did not apply (skip rule), 0 = shown; empty = not reached',
            ),
          ]
        : []),
    ]),
  ];

  const rows: CellValue[][] = input.respondents.map((r) => {
    const plan = plans.get(r.id);
    const version = versionNumber.get(r.versionId);
    const inclusion = getInclusion(r);
    const answer = (screenKey: string) => choiceOf.get(`${r.id}|${screenKey}`);
    const own = input.answers.get(r.id);
    return [
      r.id,
      r.number,
      ...(input.personal ? [r.externalId] : []),
      version?.version ?? null,
      r.block,
      r.status,
      inclusion.included,
      inclusion.exclusion,
      r.startedAt.toISOString(),
      r.finishedAt?.toISOString() ?? null,
      seconds(r.durationMs),
      getFlagNames(r.flags).join('; '),
      ...taskNumbers.flatMap((k) => {
        const task = plan?.taskOrder[k - 1];
        const a = task === undefined ? undefined : answer(`task:${task}`);
        return [
          task ?? null,
          choiceCode(a?.chosenAlternative),
          a?.chosenPosition === null || a?.chosenPosition === undefined
            ? null
            : a.chosenPosition + 1,
          seconds(a?.responseMs),
          ...(asksCertainty ? [certaintyOf(a?.value)] : []),
        ];
      }),
      ...holdoutNumbers.flatMap((h) => {
        const key = version?.holdouts[h - 1]?.screenKey;
        const a = key ? answer(key) : undefined;
        return [choiceCode(a?.chosenAlternative), seconds(a?.responseMs)];
      }),
      ...input.questions.flatMap((q) => {
        const value = own?.get(q.key);
        const text = formatAnswer(q, value);
        const answer = q.type === 'number' && text !== null ? Number(text) : text;
        return q.conditional ? [answer, getSkippedFlag(value)] : [answer];
      }),
    ];
  });
  return { name: 'respondents-wide', columns, rows };
}
