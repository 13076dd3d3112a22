/**
 * Automatic data-quality flags for choice data. Pure functions of the stored answers; they flag,
 * they never exclude — the researcher decides (flag and run a sensitivity analysis rather than
 * delete automatically: Tervonen et al. 2018, Value in Health 21(10); docs/methods.md).
 *
 * - speeder: total time below a fraction of the median time of completed respondents
 *   (default ½ — common practice, no source; docs/methods.md, "Fieldwork, quality flags");
 * - samePosition: the same on-screen position in every design task ("always left"; Q2, [CP]);
 * - alwaysFixed: the status quo / opt-out in every design task (serial opt-out; Q3);
 * - dominanceFailed: a dominated alternative chosen in the dominance test (Q1);
 * - inconsistent: a different alternative chosen when a task is repeated (test-retest, Q1).
 */
import type { QualityFlags } from '../../shared/schemas/responses';
import type { TaskKind } from '../../shared/schemas/respondent';

/** One answered choice screen as stored (answers row plus the kind kept in its value). */
export type ChoiceAnswer = {
  taskKind: TaskKind;
  /** Design task number (design tasks only). */
  taskNumber: number | null;
  /** Design index of the chosen alternative; -1 = the status quo / opt-out. */
  chosenAlternative: number | null;
  chosenPosition: number | null;
  /** Repeat screens: the design task they repeat. */
  repeatOfTask?: number | null;
  /** Dominance screens: whether the dominant alternative was chosen. */
  dominantChosen?: boolean | null;
};

/**
 * A stored choice answer as the flags read it. The task kind, repeated task and dominance
 * outcome live in the answer's value (answer-shape.ts); rows written before the kind was stored
 * count as a design task when they have a task number, else as a warm-up.
 */
export function readChoiceAnswer(row: {
  taskNumber: number | null;
  chosenAlternative: number | null;
  chosenPosition: number | null;
  value: unknown;
}): ChoiceAnswer {
  const v = (row.value ?? {}) as {
    taskKind?: TaskKind;
    repeatOfTask?: number;
    dominantChosen?: boolean;
  };
  return {
    taskKind: v.taskKind ?? (row.taskNumber !== null ? 'design' : 'warmup'),
    taskNumber: row.taskNumber,
    chosenAlternative: row.chosenAlternative,
    chosenPosition: row.chosenPosition,
    repeatOfTask: v.repeatOfTask ?? null,
    dominantChosen: v.dominantChosen ?? null,
  };
}

export type RespondentForFlags = {
  id: string;
  status: 'in_progress' | 'completed' | 'screened_out' | 'over_quota';
  durationMs: number | null;
  choices: ChoiceAnswer[];
};

/**
 * Fewer design tasks than this leave position and fixed-alternative patterns unassessed: with
 * three cards, 4 equal positions happen by chance 3·(1/3)⁴ ≈ 3.7% of the time (our choice).
 */
export const MIN_TASKS_FOR_PATTERNS = 4;
/** A median of fewer completes is too unstable to call anybody a speeder (our choice). */
export const MIN_COMPLETES_FOR_SPEEDERS = 10;

/** Median of a list (mean of the middle two for an even count); null when empty. */
export function medianOf(values: readonly number[]): number | null {
  if (values.length === 0) return null;
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 === 1 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}

/** The speeder cut-off in ms, or null when too few respondents have completed. */
export function speederThresholdMs(
  completedDurations: readonly number[],
  fraction: number,
): number | null {
  if (!(fraction > 0 && fraction < 1)) throw new RangeError('fraction must be in (0, 1)');
  if (completedDurations.length < MIN_COMPLETES_FOR_SPEEDERS) return null;
  return fraction * medianOf(completedDurations)!;
}

export function isSpeeder(
  r: Pick<RespondentForFlags, 'status' | 'durationMs'>,
  thresholdMs: number | null,
): boolean | null {
  if (r.status !== 'completed' || r.durationMs === null || thresholdMs === null) return null;
  return r.durationMs < thresholdMs;
}

const designTasks = (choices: readonly ChoiceAnswer[]) =>
  choices.filter((c) => c.taskKind === 'design' && c.chosenPosition !== null);

/**
 * Same position in every design task, the fixed alternative excluded: always choosing the
 * status quo (which stays last on screen) is reported by alwaysFixed instead.
 */
export function choosesSamePosition(choices: readonly ChoiceAnswer[]): boolean | null {
  const tasks = designTasks(choices);
  if (tasks.length < MIN_TASKS_FOR_PATTERNS) return null;
  if (tasks.every((c) => c.chosenAlternative === -1)) return false;
  return tasks.every((c) => c.chosenPosition === tasks[0].chosenPosition);
}

/** Always the status quo / opt-out; null when the study has no fixed alternative chosen ever. */
export function choosesFixedAlways(
  choices: readonly ChoiceAnswer[],
  hasFixedAlternative: boolean,
): boolean | null {
  if (!hasFixedAlternative) return null;
  const tasks = designTasks(choices);
  if (tasks.length < MIN_TASKS_FOR_PATTERNS) return null;
  return tasks.every((c) => c.chosenAlternative === -1);
}

/** Failed when any dominance screen was answered without the dominant alternative. */
export function failsDominance(choices: readonly ChoiceAnswer[]): boolean | null {
  const tests = choices.filter((c) => c.taskKind === 'dominance');
  if (tests.length === 0) return null;
  return tests.some((c) => c.dominantChosen === false);
}

/**
 * Compares each repeat with the original design task by design index (positions differ on
 * purpose: the repeat shows the alternatives in another order).
 */
export function answersInconsistently(choices: readonly ChoiceAnswer[]): boolean | null {
  let compared = 0;
  let differs = false;
  for (const rep of choices) {
    if (rep.taskKind !== 'repeat' || rep.repeatOfTask == null) continue;
    const original = choices.find(
      (c) => c.taskKind === 'design' && c.taskNumber === rep.repeatOfTask,
    );
    if (!original || original.chosenAlternative === null) continue;
    compared++;
    if (original.chosenAlternative !== rep.chosenAlternative) differs = true;
  }
  return compared === 0 ? null : differs;
}

export type StudyFlags = {
  flags: Map<string, QualityFlags>;
  medianDurationMs: number | null;
  speederThresholdMs: number | null;
};

/** Flags of every respondent of a study, with the median and cut-off they were judged by. */
export function computeQualityFlags(
  respondents: readonly RespondentForFlags[],
  opts: { speederFraction: number; hasFixedAlternative: boolean },
): StudyFlags {
  const durations = respondents
    .filter((r) => r.status === 'completed' && r.durationMs !== null)
    .map((r) => r.durationMs!);
  const threshold = speederThresholdMs(durations, opts.speederFraction);
  const flags = new Map<string, QualityFlags>();
  for (const r of respondents) {
    flags.set(r.id, {
      speeder: isSpeeder(r, threshold),
      samePosition: choosesSamePosition(r.choices),
      alwaysFixed: choosesFixedAlways(r.choices, opts.hasFixedAlternative),
      dominanceFailed: failsDominance(r.choices),
      inconsistent: answersInconsistently(r.choices),
    });
  }
  return { flags, medianDurationMs: medianOf(durations), speederThresholdMs: threshold };
}
