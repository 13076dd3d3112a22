/**
 * One rule for answers to questions (shared/survey/question-answer.ts): the phone's check and the
 * server's check (server/services/answer-rules.ts) refuse the same answers with the same words.
 * The expected outcomes follow from each question's own settings (required, range, whole numbers).
 */
import { describe, expect, it } from 'vitest';
import { questionAnswerProblem } from '../../../shared/survey/question-answer';
import { questionSchema, type Question } from '../../../shared/schemas/questionnaire';
import type { AnswerValue, RespondentScreen } from '../../../shared/schemas/respondent';
import { englishInterfaceTexts, fillText } from '../../../shared/languages/interface-texts';
import { checkAnswerValue } from '../../../server/services/answer-rules';

const question = (q: object) => questionSchema.parse({ key: 'q1', text: 'A question', ...q });
const options = [
  { id: 'a', label: 'A' },
  { id: 'b', label: 'B' },
];
const single = question({ type: 'single', options });
const optionalSingle = question({ type: 'single', options, required: false });
const multiple = question({ type: 'multiple', options });
const people = question({ type: 'number', min: 1, max: 12 });
const share = question({ type: 'number', min: 0, max: 100, integer: false, required: false });
const text = question({ type: 'text' });

const cases: Array<[string, Question, AnswerValue, string | null]> = [
  ['a chosen option', single, { kind: 'single', optionId: 'a' }, null],
  ['no option, required', single, { kind: 'single', optionId: null }, 'Choose an answer.'],
  ['no option, optional', optionalSingle, { kind: 'single', optionId: null }, null],
  [
    'no options, required',
    multiple,
    { kind: 'multiple', optionIds: [] },
    'Choose at least one answer.',
  ],
  ['a number in range', people, { kind: 'number', number: 4 }, null],
  ['no number, required', people, { kind: 'number', number: null }, 'Enter a number.'],
  ['no number, optional', share, { kind: 'number', number: null }, null],
  ['below the range', people, { kind: 'number', number: 0 }, 'Enter a number from 1 to 12.'],
  ['above the range', people, { kind: 'number', number: 13 }, 'Enter a number from 1 to 12.'],
  [
    'a fraction for whole numbers',
    people,
    { kind: 'number', number: 2.5 },
    'Enter a whole number.',
  ],
  ['a fraction where allowed', share, { kind: 'number', number: 12.5 }, null],
  ['an empty text, required', text, { kind: 'text', text: '  ' }, 'Write an answer.'],
  ['a text', text, { kind: 'text', text: 'Less chlorine taste' }, null],
];

const screenOf = (q: Question) =>
  ({ kind: 'question', key: 'p1', question: q, showIf: null }) as unknown as RespondentScreen;

describe('questionAnswerProblem', () => {
  it.each(cases)('%s: the phone says %4$j', (_label, q, value, message) => {
    const problem = questionAnswerProblem(q, value);
    expect(problem && fillText(englishInterfaceTexts[problem.key], problem.values ?? {})).toBe(
      message,
    );
  });

  it.each(cases)(
    '%s: the server refuses with the same words, or takes it',
    (_label, q, value, message) => {
      const check = () => checkAnswerValue(screenOf(q), value);
      if (message === null) expect(check).not.toThrow();
      else expect(check).toThrow(message);
    },
  );

  it('takes text that is not a number (NaN) as out of range', () => {
    expect(questionAnswerProblem(people, { kind: 'number', number: Number.NaN })).toEqual({
      key: 'ui.number_range',
      values: { min: 1, max: 12 },
    });
  });
});
