/**
 * Going back: a respondent changes an answer they gave earlier. The new answer becomes the
 * current one and the one it replaces is kept in the history (db/queries/answer-revisions.ts),
 * so exports count every screen once and can still show what was revised. A retry with the
 * same client id gets the same receipt and writes nothing. Only screens the questionnaire lets
 * respondents go back to can be revised (shared/survey/going-back.ts), and only while the
 * session is still answering in a live study.
 */
import type { AppDeps } from '../deps';
import { AppError, ConflictError, NotFoundError, ValidationError } from '../lib/errors';
import { getRespondentByToken, getStudyByPublicId } from '../../db/queries/respondents';
import { getAnswerByClientId, listAnsweredKeys } from '../../db/queries/answers';
import {
  findReplacedByClientId,
  getCurrentAnswer,
  replaceAnswer,
} from '../../db/queries/answer-revisions';
import { respondentPlanSchema, type AnswerReceipt } from '../../shared/schemas/respondent';
import { canRevise } from '../../shared/survey/going-back';
import { readSettings } from './lifecycle';
import { redirectFor } from './respondent-session';
import { buildScreens, loadFrozenVersion } from './respondent-screens';
import { checkAnswerValue } from './answer-rules';
import { answerColumnsFor, type AnswerInput } from './answer-shape';

const notRevisable = () =>
  new ConflictError('revision_not_allowed', 'This answer cannot be changed.', [
    { path: 'screenKey', message: 'Not open to changes' },
  ]);

export async function reviseAnswer(
  deps: AppDeps,
  publicId: string,
  sessionToken: string,
  answer: AnswerInput,
  now = new Date(),
): Promise<AnswerReceipt> {
  const study = await getStudyByPublicId(deps.db, { publicId });
  if (!study || study.archivedAt)
    throw new AppError(404, 'survey_not_found', 'This survey link does not exist.');
  return deps.db.transaction(async (tx) => {
    const respondent = await getRespondentByToken(tx, {
      studyId: study.id,
      sessionToken,
      forUpdate: true,
    });
    if (!respondent) throw new NotFoundError('Session');
    const version = await loadFrozenVersion(tx, { id: respondent.versionId, studyId: study.id });
    const screens = buildScreens(version, respondentPlanSchema.parse(respondent.plan));
    const answered = await listAnsweredKeys(tx, { respondentId: respondent.id });
    const receipt = (replay: boolean): AnswerReceipt => ({
      screenKey: answer.screenKey,
      nextScreenKey:
        respondent.status === 'in_progress'
          ? (screens.find((s) => !answered.has(s.key))?.key ?? null)
          : null,
      status: respondent.status,
      redirectUrl: redirectFor(
        readSettings(study.settings),
        respondent.status,
        respondent.externalId,
      ),
      replay,
    });

    // A client id names one answer for good: the same screen again is a retry, another is a bug.
    const ids = { respondentId: respondent.id, clientId: answer.clientId };
    const used = (await getAnswerByClientId(tx, ids)) ?? (await findReplacedByClientId(tx, ids));
    if (used?.screenKey === answer.screenKey) return receipt(true);
    if (used)
      throw new ConflictError(
        'client_id_reused',
        'This answer id was already used for another screen.',
      );
    const current = await getCurrentAnswer(tx, {
      respondentId: respondent.id,
      screenKey: answer.screenKey,
    });

    if (respondent.status !== 'in_progress')
      throw new ConflictError(
        respondent.status === 'completed' ? 'already_completed' : 'already_finished',
        'This session has ended; answers can no longer be changed.',
      );
    if (study.status !== 'live')
      throw new AppError(
        410,
        'survey_closed',
        'This survey has closed; answers can no longer be changed.',
      );
    const screen = screens.find((s) => s.key === answer.screenKey);
    if (!screen)
      throw new ValidationError(
        'This screen is not part of your questionnaire.',
        [{ path: 'screenKey', message: 'Unknown screen' }],
        'unknown_screen',
      );
    if (!current)
      throw new ConflictError('not_answered', 'This screen has no answer to change yet.', [
        { path: 'screenKey', message: 'Not answered yet' },
      ]);
    if (!canRevise(screen, version.questionnaire.options)) throw notRevisable();
    checkAnswerValue(screen, answer.value);

    const repeatOf = (current.value as { repeatOfTask?: number } | null)?.repeatOfTask ?? null;
    await replaceAnswer(tx, {
      current,
      studyId: study.id,
      now,
      next: {
        clientId: answer.clientId,
        responseMs: answer.responseMs,
        ...answerColumnsFor(screen, answer.value, repeatOf),
      },
    });
    return receipt(false);
  });
}
