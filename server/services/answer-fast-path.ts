/**
 * The answer path of a panel launch: a plain in-order answer of a live session, from a
 * respondent this process already knows (known-respondents.ts), is checked against the cached
 * frozen version and stored by one statement that also re-checks, in the database, everything
 * that can change (db/queries/answer-fast-path.ts). Whenever that statement writes nothing —
 * a retry, a closed or closing study, a quota (segment quotas are known here and sent there at
 * once), an answer out of order, a session that ended —
 * the caller takes the full path, which decides exactly as if this one did not exist. So this
 * path only ever says yes: a stored answer, or the receipt of a plain retry (the same client
 * id, screen and value, which the statement reads back when it writes nothing, answered as
 * the full path would: answer-conflicts.ts); every refusal and 409 comes from the full path.
 */
import type { Db } from '../../db/client';
import type { AnswerReceipt, RespondentStatus } from '../../shared/schemas/respondent';
import {
  insertAnswerIfOpen,
  insertAnswersIfOpen,
  type FastAnswer,
  type FastAnswerResult,
  type NothingWritten,
} from '../../db/queries/answer-fast-path';
import { isDataException } from '../lib/db-errors';
import { keyedBatcherPer, type KeyedBatcherOptions } from '../lib/keyed-batcher';
import { readSettings } from './lifecycle';
import { redirectFor } from './respondent-session';
import { loadFrozenVersion } from './respondent-screens';
import { screensOfRespondent } from './respondent-screen-index';
import { checkAnswerValue } from './answer-rules';
import { shapeAnswer, type AnswerInput } from './answer-shape';
import { findKnownRespondent } from './known-respondents';
import { segmentQuotaApplies } from './segment-quotas';
import { ruleOfScreen } from '../../shared/survey/skip-logic';
import { isRetryOf, nextUnanswered } from './answer-conflicts';

/**
 * Answers that continue a session, gathered per pool (those read in the same turn of the event
 * loop, and those that wait while two statements are in flight): under a panel launch one
 * multi-row statement (one round trip, one commit) stores several of them, where each used to
 * pay its own (bench:fieldwork, 26,000 continuing answers: 12,800 statements; 16,700 when only
 * the answers waiting behind statements in flight were gathered). At most two are in flight, so
 * the other connections of the pool stay free for session starts and the full path; 64 per
 * batch keeps one statement's work (and its wait) short. One answer per respondent per batch
 * (keyed-batcher.ts).
 */
export const fastAnswerBatcherOf = keyedBatcherPer(
  (db: Db): KeyedBatcherOptions<FastAnswer, FastAnswerResult | null> => ({
    maxBatch: 64,
    maxInFlight: 2,
    keyOf: (a) => a.respondentId,
    runOne: (a) => insertAnswerIfOpen(db, a),
    runBatch: (batch) => insertAnswersIfOpen(db, batch),
  }),
);

/** The receipt of a stored answer, or null when the full path must decide. */
export async function saveAnswerFast(
  db: Db,
  params: { publicId: string; sessionToken: string; answer: AnswerInput; now: Date },
): Promise<AnswerReceipt | null> {
  const { answer, now } = params;
  const respondent = findKnownRespondent(params.publicId, params.sessionToken);
  if (!respondent) return null;
  const version = await loadFrozenVersion(db, {
    id: respondent.versionId,
    studyId: respondent.studyId,
  });
  const { screens, plan } = screensOfRespondent(version, respondent);
  const index = screens.findIndex((s) => s.key === answer.screenKey);
  // A page with a skip rule needs the earlier answers: the full path checks it.
  if (index < 0 || ruleOfScreen(screens[index])) return null;
  try {
    checkAnswerValue(screens[index], answer.value);
  } catch {
    return null; // the full path gives the same 400, after its own checks in its own order
  }
  const seen = { plan, screens, index };
  const { row, status, durationMs } = shapeAnswer(version, respondent, seen, answer, now);
  // Segment quotas count other respondents' completes: the full path decides those answers.
  if (segmentQuotaApplies(version, answer.screenKey, status)) return null;
  let stored;
  try {
    const fast: FastAnswer = {
      ...row,
      answeredBefore: screens.slice(0, index).map((s) => s.key),
      status,
      durationMs,
    };
    // An answer that ends the session also sets its status (and may free its block place):
    // the one-answer statement does that; the batch only stores.
    stored = await (status === 'in_progress'
      ? fastAnswerBatcherOf(db).submit(fast)
      : insertAnswerIfOpen(db, fast));
  } catch (err) {
    // A study setting the statement could not read (a malformed closing date): decide slowly.
    if (isDataException(err)) return null;
    throw err;
  }
  if (!stored) return null;
  const receipt = (done: RespondentStatus, next: number, replay: boolean): AnswerReceipt => ({
    screenKey: answer.screenKey,
    nextScreenKey: done === 'in_progress' ? (screens[next]?.key ?? null) : null,
    status: done,
    redirectUrl:
      done === 'in_progress'
        ? null
        : redirectFor(readSettings(stored.settings), done, respondent.externalId),
    replay,
  });
  if (stored.id) return receipt(status, index + 1, false);
  const retry = retryOf(stored.refused, answer);
  return retry ? receipt(retry.status, nextUnanswered(screens, retry.answered), true) : null;
}

/**
 * The refused write was this answer sent again, in a study that still exists: the full path
 * would find the same stored row and give the same receipt (resolveRefusedAnswer).
 */
function retryOf(
  refused: NothingWritten | null,
  answer: AnswerInput,
): { status: RespondentStatus; answered: string[] } | null {
  if (!refused?.mine || refused.archived || !isRetryOf(refused.mine, answer)) return null;
  return { status: refused.status as RespondentStatus, answered: refused.answered };
}
