/**
 * What is wrong with an answer to a question, in the words the respondent is shown: an
 * interface text key and its values, or null when the answer fits the question. The
 * respondent's phone checks with it before sending (in the respondent's language), and the
 * server checks again with it (server/services/answer-rules.ts, in English), so both refuse
 * exactly the same answers.
 */
import type { InterfaceTextKey } from '../languages/interface-texts';
import type { Question } from '../schemas/questionnaire';
import type { AnswerValue } from '../schemas/respondent';

export type AnswerProblem = { key: InterfaceTextKey; values?: Record<string, number> };

export function questionAnswerProblem(q: Question, value: AnswerValue): AnswerProblem | null {
  if (value.kind === 'single' && value.optionId === null && q.required)
    return { key: 'ui.answer_required' };
  if (value.kind === 'multiple' && value.optionIds.length === 0 && q.required)
    return { key: 'ui.answers_required' };
  if (value.kind === 'number' && q.type === 'number') {
    if (value.number === null) return q.required ? { key: 'ui.number_required' } : null;
    // A NaN (text that is not a number) fails both comparisons: it is out of range too.
    if (!(value.number >= q.min && value.number <= q.max))
      return { key: 'ui.number_range', values: { min: q.min, max: q.max } };
    if (q.integer && !Number.isInteger(value.number)) return { key: 'ui.whole_number' };
  }
  if (value.kind === 'text' && value.text.trim() === '' && q.required)
    return { key: 'ui.text_required' };
  return null;
}
