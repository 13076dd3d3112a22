/**
 * The server's side of skip logic (shared/survey/skip-logic.ts): a page with a rule is
 * answered only when the rule matches the respondent's earlier answers, and skipped only when
 * it does not. The phone decides the same way; this check keeps a wrong or stale phone from
 * storing an answer to a question that was never meant for the respondent, or skipping one that was.
 */
import type { DbOrTx } from '../../db/client';
import { listAnswerValues } from '../../db/queries/answers';
import { ValidationError } from '../lib/errors';
import type { AnswerValue, RespondentScreen } from '../../shared/schemas/respondent';
import { ruleOfScreen, screenApplies } from '../../shared/survey/skip-logic';

export async function checkSkipRule(
  db: DbOrTx,
  params: { respondentId: string; screen: RespondentScreen; value: AnswerValue },
): Promise<void> {
  const rule = ruleOfScreen(params.screen);
  if (!rule) return;
  const stored = await listAnswerValues(db, { respondentId: params.respondentId });
  const applies = screenApplies(rule, Object.fromEntries(stored) as Record<string, AnswerValue>);
  const skipped = params.value.kind === 'skipped';
  if (applies && skipped)
    throw new ValidationError(
      'This question applies to you: please answer it.',
      [{ path: 'value', message: 'Not skippable: the earlier answer shows this page' }],
      'invalid_answer',
    );
  if (!applies && !skipped)
    throw new ValidationError(
      'This page does not apply to you and is skipped.',
      [{ path: 'value', message: 'Skip this page: the earlier answer hides it' }],
      'invalid_answer',
    );
}
