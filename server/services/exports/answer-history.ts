/**
 * The answer-history table: for every screen a respondent went back to and changed, each
 * answer it had, oldest first, the last one marked current. Estimation and the other downloads
 * read the current answer only; this table shows what was revised and when.
 */
import type { TasteQuestion } from '../../../shared/schemas/tastes';
import { formatAnswer } from '../tastes/background-answers';
import type { CellValue } from '../../lib/safe-csv';

export type HistoryRow = {
  respondentId: string;
  screenKey: string;
  taskNumber: number | null;
  chosenAlternative: number | null;
  value: unknown;
  responseMs: number | null;
  answeredAt: Date;
  /** Null for the current answer. */
  replacedAt: Date | null;
};

export const answerHistoryHeader = [
  'respondent',
  'number',
  'screen',
  'task',
  'version',
  'current',
  'answer',
  'chosen_alternative',
  'response_ms',
  'answered_at',
  'replaced_at',
];

// Code-point order, not the machine's locale, so every server writes the same file.
const byCodePoint = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);
const replacedTime = (r: HistoryRow) => r.replacedAt?.getTime() ?? Number.MAX_SAFE_INTEGER;

/**
 * One row per answer a revised screen had, in respondent-number order (the order runs read
 * respondents in, RUN_DATA_ORDER), then by screen key, oldest answer first. `numbers` gives each respondent's 1-based number (as
 * in the background-answers download); `questions` are the questions this role may read, so
 * the answer text of any other question is left out.
 */
export function buildAnswerHistory(
  rows: readonly HistoryRow[],
  numbers: ReadonlyMap<string, number>,
  questions: readonly TasteQuestion[],
): CellValue[][] {
  const byKey = new Map(questions.map((q) => [`q:${q.key}`, q]));
  const sorted = [...rows].sort(
    (a, b) =>
      (numbers.get(a.respondentId) ?? 0) - (numbers.get(b.respondentId) ?? 0) ||
      byCodePoint(a.screenKey, b.screenKey) ||
      a.answeredAt.getTime() - b.answeredAt.getTime() ||
      replacedTime(a) - replacedTime(b),
  );
  const versions = new Map<string, number>();
  return sorted.map((r) => {
    const id = `${r.respondentId}/${r.screenKey}`;
    const version = (versions.get(id) ?? 0) + 1;
    versions.set(id, version);
    const question = byKey.get(r.screenKey);
    return [
      r.respondentId,
      numbers.get(r.respondentId) ?? null,
      r.screenKey,
      r.taskNumber,
      version,
      r.replacedAt === null,
      question ? formatAnswer(question, r.value) : null,
      r.chosenAlternative,
      r.responseMs,
      r.answeredAt.toISOString(),
      r.replacedAt?.toISOString() ?? null,
    ];
  });
}

/** "q:age ×1; task:3 ×2": the screens of one respondent that were changed, and how often. */
export function revisedScreensOf(rows: readonly { screenKey: string; revisionCount: number }[]) {
  return rows.map((r) => `${r.screenKey} ×${r.revisionCount}`).join('; ');
}
