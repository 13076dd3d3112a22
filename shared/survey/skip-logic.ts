/**
 * Skip logic: a question, screening or instructions page can be shown only when the answer to
 * an earlier question matches. A page that does not apply is still a step in the respondent's
 * sequence, answered as `{ kind: 'skipped' }`, so every screen keeps exactly one stored row,
 * answers stay in order, and exports can tell "not asked" from "not answered". Both sides use
 * this module: the respondent app and the Preview to go past a page, the server to refuse a
 * skip of a page that applies and an answer to one that does not.
 */
import { screenKeys, type QuestionnairePage, type ShowIf } from '../schemas/questionnaire';
import type { AnswerValue, RespondentScreen } from '../schemas/respondent';

export type SkipProblem = { path: (string | number)[]; message: string };

const questionOf = (p: QuestionnairePage) =>
  p.kind === 'question' || p.kind === 'screening' ? p.question : null;

/** The rule of a page, if it has one. */
export function showIfOf(p: QuestionnairePage): ShowIf | null {
  return p.kind === 'question' || p.kind === 'screening' || p.kind === 'instructions'
    ? (p.showIf ?? null)
    : null;
}

/** The rule a respondent screen carries, if any. */
export const ruleOfScreen = (screen: RespondentScreen): ShowIf | undefined =>
  screen.kind === 'question' || screen.kind === 'instructions' ? screen.showIf : undefined;

/** Why page `index`'s rule cannot be used: it must name an earlier choice or number question. */
export function skipRuleProblems(
  pages: readonly QuestionnairePage[],
  index: number,
): SkipProblem[] {
  const rule = showIfOf(pages[index]);
  if (!rule) return [];
  const earlier = pages.slice(0, index).map(questionOf);
  const q = earlier.find((x) => x?.key === rule.questionKey);
  if (!q) {
    const later = pages.slice(index).some((p) => questionOf(p)?.key === rule.questionKey);
    return [
      {
        path: ['questionKey'],
        message: later
          ? `"${rule.questionKey}" comes after this page: a page can depend only on earlier questions`
          : `There is no question "${rule.questionKey}"`,
      },
    ];
  }
  if (q.type === 'text')
    return [{ path: ['questionKey'], message: 'A page cannot depend on a free-text answer' }];
  if (q.type === 'number') {
    if (rule.min === null && rule.max === null)
      return [{ path: ['min'], message: 'Give the lowest or highest answer that shows this page' }];
    if (rule.min !== null && rule.max !== null && rule.min > rule.max)
      return [{ path: ['max'], message: 'The highest answer must not be below the lowest' }];
    return [];
  }
  if (rule.optionIds.length === 0)
    return [{ path: ['optionIds'], message: 'Choose the answers that show this page' }];
  if (rule.optionIds.some((id) => !q.options.some((o) => o.id === id)))
    return [{ path: ['optionIds'], message: `An answer of "${q.key}" no longer exists` }];
  return [];
}

/** Whether the earlier answer matches the rule; a missing, empty or skipped answer does not. */
export function ruleMatches(rule: ShowIf, answer: AnswerValue | undefined): boolean {
  if (!answer) return false;
  switch (answer.kind) {
    case 'single':
      return answer.optionId !== null && rule.optionIds.includes(answer.optionId);
    case 'multiple':
      return answer.optionIds.some((id) => rule.optionIds.includes(id));
    case 'number':
      return (
        answer.number !== null &&
        (rule.min === null || answer.number >= rule.min) &&
        (rule.max === null || answer.number <= rule.max)
      );
    default:
      return false;
  }
}

/** Whether a screen with this rule is shown, given the answers so far by screen key. */
export function screenApplies(
  rule: ShowIf | null | undefined,
  given: Readonly<Record<string, AnswerValue | undefined>>,
): boolean {
  return !rule || ruleMatches(rule, given[screenKeys.question(rule.questionKey)]);
}

/** The first screen from `from` on that applies (screens.length when none is left). */
export function nextShownIndex(
  screens: readonly RespondentScreen[],
  from: number,
  given: Readonly<Record<string, AnswerValue | undefined>>,
): number {
  let i = from;
  while (i < screens.length && !screenApplies(ruleOfScreen(screens[i]), given)) i++;
  return i;
}
