/**
 * Background questions of a study (from its frozen questionnaire) and respondents' answers to
 * them as readable text. Free-text answers may identify a person, so they count as personal.
 */
import { questionnairePageSchema, type Question } from '../../../shared/schemas/questionnaire';
import type { TasteQuestion } from '../../../shared/schemas/tastes';

/** Questions of the question and screening pages; pages that do not parse are skipped. */
export function getBackgroundQuestions(questionnaire: unknown): TasteQuestion[] {
  const pages = (questionnaire as { pages?: unknown[] } | null)?.pages;
  if (!Array.isArray(pages)) return [];
  const questions: { question: Question; conditional: boolean }[] = [];
  for (const raw of pages) {
    const parsed = questionnairePageSchema.safeParse(raw);
    if (!parsed.success) continue;
    const page = parsed.data;
    if (page.kind === 'question' || page.kind === 'screening')
      questions.push({ question: page.question, conditional: Boolean(page.showIf) });
  }
  return questions.map(({ question: q, conditional }) => ({
    key: q.key,
    text: q.text,
    type: q.type,
    options: q.type === 'single' || q.type === 'multiple' ? q.options : [],
    personal: q.type === 'text',
    ...(conditional ? { conditional } : {}),
  }));
}

/**
 * Whether a conditional question's page was passed by its skip rule: 1 = it did not apply
 * (stored as a skipped answer), 0 = it was shown, null = the respondent never reached it.
 * Exports put this beside the answer, so "skipped by design" and "not answered" stay apart
 * while the answer column keeps its type.
 */
export function getSkippedFlag(value: unknown): 0 | 1 | null {
  if (value === undefined || value === null) return null;
  return (value as { kind?: unknown }).kind === 'skipped' ? 1 : 0;
}

/** Column name of a conditional question's skip flag, beside the answer column `answerKey`. */
export const skippedColumnKey = (answerKey: string) => `${answerKey}_skipped`;

/** The readable answer: option labels (joined by "; "), the number, or the text. */
export function formatAnswer(question: TasteQuestion, value: unknown): string | null {
  const v = value as Record<string, unknown> | null;
  if (!v || typeof v !== 'object') return null;
  const label = (id: unknown) => question.options.find((o) => o.id === id)?.label ?? String(id);
  if (v.kind === 'single') return v.optionId == null ? null : label(v.optionId);
  if (v.kind === 'multiple' && Array.isArray(v.optionIds)) return v.optionIds.map(label).join('; ');
  if (v.kind === 'number') return typeof v.number === 'number' ? String(v.number) : null;
  if (v.kind === 'text') return typeof v.text === 'string' ? v.text : null;
  return null;
}

/** The grouping key of an answer: option id for single choice, the number as text. */
export function getAnswerKey(value: unknown): string | null {
  const v = value as Record<string, unknown> | null;
  if (!v || typeof v !== 'object') return null;
  if (v.kind === 'single' && typeof v.optionId === 'string') return v.optionId;
  if (v.kind === 'number' && typeof v.number === 'number') return String(v.number);
  return null;
}

/** respondent id → question key → raw answer value. */
export function indexAnswers(
  rows: readonly { respondentId: string; screenKey: string; value: unknown }[],
): Map<string, Map<string, unknown>> {
  const byRespondent = new Map<string, Map<string, unknown>>();
  for (const row of rows) {
    let answersOf = byRespondent.get(row.respondentId);
    if (!answersOf) byRespondent.set(row.respondentId, (answersOf = new Map()));
    answersOf.set(row.screenKey.slice(2), row.value);
  }
  return byRespondent;
}
