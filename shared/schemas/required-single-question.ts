import type { Question } from './questionnaire';

type SingleQuestion = Extract<Question, { type: 'single' }>;

/**
 * A required single-choice question without help text: how the page defaults, the page templates
 * and the demo questionnaire start their choice questions.
 */
export function requiredSingleQuestion(
  key: string,
  text: string,
  options: SingleQuestion['options'],
): SingleQuestion {
  return { type: 'single', key, text, help: '', required: true, options };
}
