/**
 * The answer path of a panel launch: a plain in-order answer of a live session, from a
 * respondent this process already knows (known-respondents.ts), is checked against the cached
 * frozen version and stored by one statement that also re-checks, in the database, everything
 * that can change (db/queries/answer-fast-path.ts). Whenever that statement writes nothing —
 * a retry, a closed or closing study, a quota (segment quotas are known here and sent there at
 * once), an answer out of order, a session that ended —
 * the caller takes the full path, which decides exactly as if this one did not exist. So this
 * path only ever says yes; every refusal, receipt of a retry and 409 comes from the full path.
 */
import type { Db } from '../../db/client';
import type { AnswerReceipt } from '../../shared/schemas/respondent';
import { insertAnswerIfOpen } from '../../db/queries/answer-fast-path';
import { isDataException } from '../lib/db-errors';
import { readSettings } from './lifecycle';
import { redirectFor } from './respondent-session';
import { loadFrozenVersion } from './respondent-screens';
import { screensOfRespondent } from './respondent-screen-index';
import { checkAnswerValue } from './answer-rules';
import { shapeAnswer, type AnswerInput } from './answer-shape';
import { findKnownRespondent } from './known-respondents';
import { segmentQuotaApplies } from './segment-quotas';
import { ruleOfScreen } from '../../shared/survey/skip-logic';

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
    stored = await insertAnswerIfOpen(db, {
      ...row,
      answeredBefore: screens.slice(0, index).map((s) => s.key),
      status,
      durationMs,
    });
  } catch (err) {
    // A study setting the statement could not read (a malformed closing date): decide slowly.
    if (isDataException(err)) return null;
    throw err;
  }
  if (!stored?.id) return null;
  return {
    screenKey: answer.screenKey,
    nextScreenKey: status === 'in_progress' ? (screens[index + 1]?.key ?? null) : null,
    status,
    redirectUrl:
      status === 'in_progress'
        ? null
        : redirectFor(readSettings(stored.settings), status, respondent.externalId),
    replay: false,
  };
}
