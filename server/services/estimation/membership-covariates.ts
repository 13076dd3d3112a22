/**
 * Class-membership covariates of a latent class run from the study's background answers
 * (the multinomial logit membership model of Kamakura & Russell 1989; Greene & Hensher 2003, §3).
 * - A single-choice question gives one 0/1 column per answer option chosen in the run but the
 *   first of them (in questionnaire order), which is the base level; options nobody in the run
 *   chose get no column (their coefficient would not be identified).
 * - A numeric question is used as it is.
 * - A missing answer (never reached, or passed by a skip rule) keeps the respondent: a single-choice question gets a "not answered" column,
 *   and a numeric one takes the mean of the answered values plus a "not answered" 0/1 column
 *   (the missing-indicator method, Cohen & Cohen 1983, §7.4; with it the numeric coefficient is
 *   estimated from the respondents who answered). Both columns appear only when someone in the
 *   run did not answer.
 * Free-text and multiple-choice questions are refused: free text is personal and not a level,
 * and a multiple choice is several questions at once.
 */
import type { TasteQuestion } from '../../../shared/schemas/tastes';
import { MEMBERSHIP_MAX_OPTIONS } from '../../../shared/schemas/estimation-families';
import type { MembershipCovariates } from '../../engine/latent-class/check-latent-class-options';
import { ValidationError } from '../../lib/errors';
import { StudyDataError } from './study-data-error';

export type MembershipQuestion = Pick<TasteQuestion, 'key' | 'text' | 'type' | 'options'>;

/**
 * The questions `keys` names, checked: each must be a single-choice question with at most
 * MEMBERSHIP_MAX_OPTIONS options or a numeric question. Throws 400 naming spec.membership.<i>.
 */
export function resolveMembershipQuestions(
  questions: readonly MembershipQuestion[],
  keys: readonly string[],
): MembershipQuestion[] {
  return keys.map((key, i) => {
    const question = questions.find((q) => q.key === key);
    const fail = (message: string): never => {
      throw new ValidationError(message, [{ path: `spec.membership.${i}`, message }]);
    };
    if (!question) return fail(`The questionnaire has no background question ${key}`);
    if (question.type === 'text')
      return fail(`${key} is a free-text question; class membership uses choice or number answers`);
    if (question.type === 'multiple')
      return fail(
        `${key} allows several answers; class membership uses single-choice or number questions`,
      );
    if (question.type === 'single' && question.options.length > MEMBERSHIP_MAX_OPTIONS)
      return fail(
        `${key} has ${question.options.length} answer options; class membership takes at most ${MEMBERSHIP_MAX_OPTIONS} (merge options or leave it out)`,
      );
    return question;
  });
}

/** The answer as the coder reads it: an option id, a number, or null (missing). */
function readAnswer(question: MembershipQuestion, value: unknown): string | number | null {
  const v = value as Record<string, unknown> | null;
  if (!v || typeof v !== 'object') return null;
  if (question.type === 'single' && typeof v.optionId === 'string') return v.optionId;
  if (question.type === 'number' && typeof v.number === 'number' && Number.isFinite(v.number))
    return v.number;
  return null;
}

/**
 * Codes the questions for the respondents `respondentIds` (rows in that order) from
 * answers: respondent id → question key → stored answer. Throws StudyDataError when a question
 * cannot separate respondents (nobody answered it, or everyone gave the same answer).
 */
export function buildMembershipCovariates(
  questions: readonly MembershipQuestion[],
  respondentIds: readonly string[],
  answers: ReadonlyMap<string, ReadonlyMap<string, unknown>>,
): MembershipCovariates {
  const N = respondentIds.length;
  const columns: { name: string; values: Float64Array }[] = [];
  const same = (key: string) =>
    new StudyDataError(
      'no_data',
      `Everyone in this run gave the same answer to ${key}, so it cannot explain class membership.`,
    );
  for (const q of questions) {
    const read = respondentIds.map((id) => readAnswer(q, answers.get(id)?.get(q.key)));
    const missing = Float64Array.from(read, (a) => (a === null ? 1 : 0));
    const anyMissing = missing.some((m) => m === 1);
    if (q.type === 'single') {
      // Levels present in the run, in questionnaire order; the first of them is the base.
      const present = q.options.filter((o) => read.includes(o.id));
      if (present.length + (anyMissing ? 1 : 0) < 2) throw same(q.key);
      for (const option of present.slice(1))
        columns.push({
          name: `${q.key}: ${option.label}`,
          values: Float64Array.from(read, (a) => (a === option.id ? 1 : 0)),
        });
      if (anyMissing && present.length > 0)
        columns.push({ name: `${q.key}: not answered`, values: missing });
      continue;
    }
    const answered = read.filter((a): a is number => typeof a === 'number');
    if (answered.length === 0)
      throw new StudyDataError('no_data', `Nobody in this run answered ${q.key}.`);
    if (answered.every((x) => x === answered[0])) throw same(q.key);
    const mean = answered.reduce((s, x) => s + x, 0) / answered.length;
    columns.push({
      name: q.key,
      values: Float64Array.from(read, (a) => (typeof a === 'number' ? a : mean)),
    });
    if (anyMissing) columns.push({ name: `${q.key}: not answered`, values: missing });
  }
  const M = columns.length;
  const values = new Float64Array(N * M);
  columns.forEach((c, m) => c.values.forEach((x, n) => (values[n * M + m] = x)));
  return { names: columns.map((c) => c.name), values };
}
