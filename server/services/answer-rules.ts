/** Whether an answer fits its screen, and whether a screening answer screens the respondent out. */
import { ValidationError } from '../lib/errors';
import type { AnswerValue, RespondentScreen } from '../../shared/schemas/respondent';
import type { QuestionnairePage } from '../../shared/schemas/questionnaire';
import { englishInterfaceTexts, fillText } from '../../shared/languages/interface-texts';
import { questionAnswerProblem } from '../../shared/survey/question-answer';

const invalid = (message: string) =>
  new ValidationError(message, [{ path: 'value', message }], 'invalid_answer');

export function checkAnswerValue(screen: RespondentScreen, value: AnswerValue): void {
  if (value.kind === 'skipped') {
    // Whether the rule really does not match needs the earlier answers (skip-rules.ts).
    if ((screen.kind === 'question' || screen.kind === 'instructions') && screen.showIf) return;
    throw invalid('This screen cannot be skipped.');
  }
  switch (screen.kind) {
    case 'consent':
      if (value.kind !== 'consent') throw invalid('Agree to take part to continue.');
      return;
    case 'instructions':
      if (value.kind !== 'ack') throw invalid('This screen takes no answer.');
      return;
    case 'task':
      if (value.kind !== 'choice') throw invalid('Choose one of the options.');
      if (value.position >= screen.alternatives.length)
        throw invalid('There is no option at that position.');
      if (screen.certainty) {
        if (value.certainty === undefined) throw invalid('Say how sure you are about this choice.');
        if (value.certainty > screen.certainty.points)
          throw invalid(`Choose a number from 1 to ${screen.certainty.points}.`);
      } else if (value.certainty !== undefined)
        throw invalid('This task does not ask how sure you are.');
      return;
    case 'question': {
      const q = screen.question;
      if (value.kind !== q.type) throw invalid(`This question takes a ${q.type} answer.`);
      const problem = questionAnswerProblem(q, value);
      if (problem)
        throw invalid(fillText(englishInterfaceTexts[problem.key], problem.values ?? {}));
      if (value.kind === 'single' && q.type === 'single' && value.optionId !== null)
        if (!q.options.some((o) => o.id === value.optionId)) throw invalid('Unknown option.');
      if (value.kind === 'multiple' && q.type === 'multiple') {
        if (new Set(value.optionIds).size !== value.optionIds.length)
          throw invalid('An option is listed twice.');
        if (value.optionIds.some((id) => !q.options.some((o) => o.id === id)))
          throw invalid('Unknown option.');
      }
      if (value.kind === 'text' && q.type === 'text' && value.text.length > q.maxLength)
        throw invalid(`Keep the answer under ${q.maxLength} characters.`);
      return;
    }
  }
}

export function screensOut(page: QuestionnairePage, value: AnswerValue): boolean {
  if (page.kind !== 'screening') return false;
  if (value.kind === 'single')
    return value.optionId !== null && page.screenOutOptionIds.includes(value.optionId);
  if (value.kind === 'multiple')
    return value.optionIds.some((id) => page.screenOutOptionIds.includes(id));
  if (value.kind === 'number' && value.number !== null)
    return (
      (page.acceptMin !== null && value.number < page.acceptMin) ||
      (page.acceptMax !== null && value.number > page.acceptMax)
    );
  return false;
}
