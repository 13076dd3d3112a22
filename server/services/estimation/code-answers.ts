/**
 * The pure heart of the data preparation: from study versions (definition + design + which
 * tasks are warm-up or holdout) and respondents' choice answers to long rows, one row per
 * alternative shown, coded with each attribute's coding (shared/engine/coding): dummy,
 * effects or linear, alternative-specific constants for labeled alternatives and one for the
 * opt-out / status quo. Warm-up tasks are left out; holdout tasks (fixed alternatives of the
 * questionnaire) are flagged so the engine keeps them apart for the holdout hit rate; repeated
 * tasks and dominance tests are checks, not data. Answers are put in task order, and the
 * respondents in the run's data order (shared/schemas/run.ts, RunDataOrder), so the same
 * answers always give the same rows (and the same data hash).
 */
import type { LongChoiceRow } from '../../engine/estimation/choice-data';
import { buildCodingPlan } from '../../../shared/engine/coding/coding-plan';
import { codeAlternative } from '../../../shared/engine/coding/code-alternative';
import type { CodedColumn } from '../../../shared/engine/coding/coded-columns';
import type { Design } from '../../../shared/schemas/design';
import type { StudyDefinition } from '../../../shared/schemas/study-definition';
import {
  RUN_DATA_ORDER,
  type RunDataOrder,
  type RunDataSummary,
} from '../../../shared/schemas/run';
import { getColumnCodes } from './column-codes';
import { StudyDataError } from './study-data-error';

/** A holdout task of the questionnaire: fixed alternatives, answered under its screen key. */
export interface HoldoutTask {
  screenKey: string;
  alternatives: readonly { levels: Record<string, string> }[];
}

export interface VersionInput {
  id: string;
  version: number;
  definition: StudyDefinition;
  design: Design;
  holdouts: readonly HoldoutTask[];
  /** Screen keys of warm-up tasks (answered, never estimated). */
  warmupKeys: readonly string[];
}

export interface ChoiceAnswerInput {
  screenKey: string;
  /** Design task number for design tasks (screen key task:<n>), else null. */
  taskNumber: number | null;
  /** Chosen alternative, 0-based in the task's own order; −1 = opt-out / status quo. */
  chosenAlternative: number | null;
}

export interface RespondentInput {
  id: string;
  versionId: string;
  answers: readonly ChoiceAnswerInput[];
}

export interface PreparedColumn extends CodedColumn {
  /** Machine name: CSV header and default coefficient name. */
  code: string;
  /** True for the column of the study's cost attribute (linear coding). */
  isCost: boolean;
}

export interface PreparedChoiceData {
  columns: PreparedColumn[];
  /** Values hold every coded column, in `columns` order. */
  rows: LongChoiceRow[];
  summary: RunDataSummary;
}

/** Coded columns of a definition with their codes and cost flag. */
export function getPreparedColumns(definition: StudyDefinition): PreparedColumn[] {
  const columns = buildCodingPlan(definition).columns;
  const codes = getColumnCodes(columns);
  const cost = definition.attributes.find((a) => a.isCost && a.coding === 'linear');
  return columns.map((c, i) => ({
    ...c,
    code: codes[i],
    isCost: c.kind === 'linear' && cost !== undefined && c.attributeId === cost.id,
  }));
}

/**
 * Codes every respondent's answered tasks; throws StudyDataError when versions disagree.
 * `order` 'respondent-number' keeps the respondents as given: callers read them in order of
 * starting, which is their respondent number (db/queries/respondent-number.ts), so rows and
 * results do not depend on the ids; 'respondent-id' (runs stored before the data order was)
 * sorts them by id as those runs did.
 */
export function codeStudyAnswers(
  versions: readonly VersionInput[],
  respondents: readonly RespondentInput[],
  order: RunDataOrder = RUN_DATA_ORDER,
): PreparedChoiceData {
  if (versions.length === 0) throw new StudyDataError('no_data', 'The study has no answers yet.');
  const latest = [...versions].sort((a, b) => b.version - a.version)[0];
  const columns = getPreparedColumns(latest.definition);
  const keys = columns.map((c) => c.key).join('\n');
  const byId = new Map(versions.map((v) => [v.id, v]));
  for (const v of versions) {
    const other = buildCodingPlan(v.definition).columns.map((c) => c.key);
    if (other.join('\n') !== keys)
      throw new StudyDataError(
        'versions_differ',
        `Version ${v.version} of the study codes its attributes differently from version ${latest.version}; estimate the versions separately.`,
      );
  }
  const plans = new Map(versions.map((v) => [v.id, buildCodingPlan(v.definition)]));
  const rows: LongChoiceRow[] = [];
  const summary: RunDataSummary = {
    respondents: 0,
    tasks: 0,
    holdoutTasks: 0,
    warmupTasksLeftOut: 0,
    respondentsWithoutTasks: 0,
    versions: [],
  };
  const perVersion = new Map<number, number>();
  const sorted =
    order === 'respondent-id'
      ? [...respondents].sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0))
      : respondents;
  for (const respondent of sorted) {
    const version = byId.get(respondent.versionId);
    if (!version) throw new StudyDataError('no_data', 'A respondent answered an unknown version.');
    const plan = plans.get(version.id)!;
    const tasks = getChoiceScreens(version);
    const rank = new Map([...tasks.keys()].map((key, i) => [key, i]));
    const answers = [...respondent.answers].sort(
      (a, b) => (rank.get(a.screenKey) ?? -1) - (rank.get(b.screenKey) ?? -1),
    );
    let used = 0;
    for (const answer of answers) {
      if (version.warmupKeys.includes(answer.screenKey)) {
        summary.warmupTasksLeftOut++;
        continue;
      }
      const screen = tasks.get(answer.screenKey);
      if (!screen || answer.chosenAlternative === null) continue;
      const chosen = answer.chosenAlternative;
      const J = screen.alternatives.length;
      if (!((chosen >= 0 && chosen < J) || (chosen === -1 && plan.fixed !== null))) continue;
      screen.alternatives.forEach((alternative, j) => {
        rows.push({
          respondent: respondent.id,
          task: screen.id,
          alt: j + 1,
          chosen: chosen === j ? 1 : 0,
          holdout: screen.holdout,
          values: codeAlternative(plan, j, alternative.levels),
        });
      });
      if (plan.fixed) {
        rows.push({
          respondent: respondent.id,
          task: screen.id,
          alt: J + 1,
          chosen: chosen === -1 ? 1 : 0,
          holdout: screen.holdout,
          values: codeAlternative(plan, 'fixed', {}),
        });
      }
      if (screen.holdout) summary.holdoutTasks++;
      else summary.tasks++;
      used++;
    }
    if (used === 0) {
      summary.respondentsWithoutTasks++;
      continue;
    }
    summary.respondents++;
    perVersion.set(version.version, (perVersion.get(version.version) ?? 0) + 1);
  }
  summary.versions = [...perVersion.keys()].sort((a, b) => a - b);
  summary.respondentsPerVersion = summary.versions.map((v) => ({
    version: v,
    respondents: perVersion.get(v)!,
  }));
  return { columns, rows, summary };
}

interface ChoiceScreen {
  /** Task id in the long rows: the design task number, or h<k> for the k-th holdout. */
  id: string | number;
  holdout: boolean;
  alternatives: readonly { levels: Record<string, string> }[];
}

/**
 * Design tasks (screen key task:<n>, as screenKeys.task in shared/schemas/questionnaire.ts)
 * and holdout tasks, in task-number then holdout order.
 */
function getChoiceScreens(version: VersionInput): Map<string, ChoiceScreen> {
  const screens: [string, ChoiceScreen][] = [...version.design.tasks]
    .sort((a, b) => a.task - b.task)
    .map((t) => [`task:${t.task}`, { id: t.task, holdout: false, alternatives: t.alternatives }]);
  version.holdouts.forEach((h, k) =>
    screens.push([h.screenKey, { id: `h${k + 1}`, holdout: true, alternatives: h.alternatives }]),
  );
  return new Map(screens);
}
