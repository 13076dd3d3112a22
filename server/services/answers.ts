/**
 * Saving one answer. A plain in-order answer of a live session from a respondent this process
 * knows takes one statement (answer-fast-path.ts); everything else comes here, to the full
 * path, which decides every refusal and retry. One read gathers the study, the respondent
 * and the screens they have answered; the checks run on the cached frozen version and the
 * respondent's cached screens; one statement then stores the answer (and, on the last screen
 * or a screening-out answer, the respondent's final status). Nothing is locked and nothing is
 * read to decide whether an answer is new: the unique indexes on (respondent, client id) and
 * (respondent, screen) decide, and only when they refuse a write is the stored row read, to
 * tell a retry (same receipt again) from a conflict (409). Answers follow the screens in
 * order, so the answered screens are always the first ones and the last screen completes.
 * Completing in a study with a quota of completes takes the quota lock (answer-quota.ts).
 */
import type { AppDeps } from '../deps';
import type { Db } from '../../db/client';
import { AppError, ConflictError, NotFoundError, ValidationError } from '../lib/errors';
import { finishRespondent, getAnswerContext } from '../../db/queries/respondents';
import { insertAnswerAndFinish } from '../../db/queries/answers';
import { releaseBlock } from '../../db/queries/respondent-blocks';
import type { AnswerReceipt, RespondentStatus } from '../../shared/schemas/respondent';
import { closeIfDue, readSettings } from './lifecycle';
import { redirectFor } from './respondent-session';
import { loadFrozenVersion } from './respondent-screens';
import { screensOfRespondent } from './respondent-screen-index';
import { checkAnswerValue } from './answer-rules';
import { shapeAnswer, type AnswerInput } from './answer-shape';
import { saveAnswerFast } from './answer-fast-path';
import { rememberRespondent } from './known-respondents';
import { resolveRefusedAnswer } from './answer-conflicts';
import { completeUnderQuota } from './answer-quota';
import { screeningCellIsFull, segmentQuotaApplies } from './segment-quotas';
import { checkSkipRule } from './skip-rules';
import { judgeLateAnswer, type LateAnswerVerdict } from './late-answers';

export type { AnswerInput };
export type AnswerContext = NonNullable<Awaited<ReturnType<typeof getAnswerContext>>>;
type Respondent = NonNullable<AnswerContext['respondent']>;

const closedMessages: Record<LateAnswerVerdict, string> = {
  accept: '',
  not_closed: 'This survey has closed; answers are no longer accepted.',
  given_after_close:
    'This survey closed before this answer was given, so it cannot be added. Thank you for your time.',
  grace_over:
    'This survey closed too long ago: answers given before the close could be sent for a limited time only.',
};

const closedError = (status: string, verdict: LateAnswerVerdict) =>
  status === 'draft'
    ? new AppError(409, 'survey_not_open', 'This survey is not open; answers are not accepted.')
    : new AppError(410, 'survey_closed', closedMessages[verdict]);

const overQuotaError = () =>
  new AppError(
    410,
    'over_quota',
    'This survey has all the answers it needs. Thank you for your time.',
  );

/** A session that is still answering, in a study that has stopped taking answers. */
async function refuseClosed(
  db: Db,
  ctx: AnswerContext,
  respondent: Respondent,
  now: Date,
  verdict: LateAnswerVerdict,
): Promise<never> {
  const settings = readSettings(ctx.study.settings);
  if (ctx.study.status === 'closed' && settings.closedReason === 'quota') {
    const ended = await finishRespondent(db, {
      id: respondent.id,
      status: 'over_quota',
      finishedAt: now,
      durationMs: now.getTime() - respondent.startedAt.getTime(),
      onlyInProgress: true,
    });
    if (ended) await releaseBlock(db, { versionId: respondent.versionId, block: respondent.block });
    throw overQuotaError();
  }
  throw closedError(ctx.study.status, verdict);
}

/**
 * Records one answer for the respondent holding `sessionToken`. The respondent API and the
 * demo seed both come through here.
 */
export async function saveAnswer(
  db: Db,
  params: ({ studyId: string } | { publicId: string }) & {
    sessionToken: string;
    answer: AnswerInput;
    now?: Date;
  },
): Promise<AnswerReceipt> {
  const now = params.now ?? new Date();
  const { answer } = params;
  // Most answers are plain in-order answers of a live session: one statement stores them.
  if ('publicId' in params) {
    const fast = await saveAnswerFast(db, { ...params, now });
    if (fast) return fast;
  }
  let ctx = await getAnswerContext(db, params);
  if (!ctx || ctx.study.archivedAt)
    throw new AppError(404, 'survey_not_found', 'This survey link does not exist.');
  const respondent = ctx.respondent;
  if (!respondent) throw new NotFoundError('Session');
  if ('publicId' in params) rememberRespondent(params.publicId, respondent);

  const version = await loadFrozenVersion(db, { id: respondent.versionId, studyId: ctx.study.id });
  const { screens, plan } = screensOfRespondent(version, respondent);
  const settings = readSettings(ctx.study.settings);
  const receipt = (status: RespondentStatus, replay: boolean, answered: number): AnswerReceipt => ({
    screenKey: answer.screenKey,
    nextScreenKey: status === 'in_progress' ? (screens[answered]?.key ?? null) : null,
    status,
    redirectUrl: redirectFor(settings, status, respondent.externalId),
    replay,
  });
  const refused = () => resolveRefusedAnswer(db, { respondent, answer, screens, receipt });

  // A screen already answered, or a session already over: only a retry can be right.
  if (ctx.answered.has(answer.screenKey) || respondent.status !== 'in_progress') return refused();

  // A passed closing date closes the study now, even if the periodic check has not run yet.
  if (ctx.study.status === 'live' && settings.closeAt && new Date(settings.closeAt) <= now) {
    const reason = await closeIfDue(db, ctx.study, now);
    const closed = { ...settings, closedReason: reason ?? 'date', closedAt: now.toISOString() };
    ctx = { ...ctx, study: { ...ctx.study, status: 'closed', settings: closed } };
  }
  // A closed study still takes answers given before its close, for a grace period.
  if (ctx.study.status !== 'live') {
    const verdict = judgeLateAnswer({
      status: ctx.study.status,
      settings: readSettings(ctx.study.settings),
      startedAt: respondent.startedAt,
      ageMs: answer.ageMs,
      now,
    });
    if (verdict !== 'accept') return refuseClosed(db, ctx, respondent, now, verdict);
  }

  const index = screens.findIndex((s) => s.key === answer.screenKey);
  if (index < 0)
    throw new ValidationError(
      'This screen is not part of your questionnaire.',
      [{ path: 'screenKey', message: 'Unknown screen' }],
      'unknown_screen',
    );
  const expected = screens.find((s) => !ctx!.answered.has(s.key))!;
  if (expected.key !== answer.screenKey)
    throw new ConflictError(
      'out_of_order',
      `Answer the screens in order; the next one is "${expected.key}".`,
      [{ path: 'screenKey', message: `Expected ${expected.key}` }],
    );
  checkAnswerValue(screens[index], answer.value);
  await checkSkipRule(db, {
    respondentId: respondent.id,
    screen: screens[index],
    value: answer.value,
  });

  const seen = { plan, screens, index };
  const shaped = shapeAnswer(version, respondent, seen, answer, now);
  const { row, durationMs } = shaped;
  let status: RespondentStatus = shaped.status;
  const studyId = ctx.study.id;
  if (status === 'in_progress' && segmentQuotaApplies(version, answer.screenKey, status)) {
    const { screenKey, value } = answer;
    const full = await screeningCellIsFull(db, { studyId, version, screenKey, value });
    if (full) status = 'over_quota';
  }

  if (
    status === 'completed' &&
    (settings.quotaCompletes !== null || segmentQuotaApplies(version, answer.screenKey, status))
  ) {
    const outcome = await completeUnderQuota(db, { studyId, row, durationMs, now, version });
    if (!outcome) return refused();
    return receipt(outcome, false, index + 1);
  }
  const stored = await insertAnswerAndFinish(db, {
    ...row,
    finish: status === 'in_progress' ? null : { status, durationMs },
  });
  if (!stored) return refused();
  return receipt(status, false, index + 1);
}

/** The respondent API's entry: the public id names the study, the token the session. */
export async function submitAnswer(
  deps: AppDeps,
  publicId: string,
  sessionToken: string,
  answer: AnswerInput,
): Promise<AnswerReceipt> {
  return saveAnswer(deps.db, { publicId, sessionToken, answer });
}
