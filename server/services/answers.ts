/**
 * Saving one answer. The step runs in one transaction with the respondent's row locked, and
 * the answer is committed before the reply leaves: a retry with the same client id finds the
 * stored row and gets the same receipt; nothing is ever written twice. Answers must follow the
 * screens in order; a finished respondent cannot add more.
 */
import type { AppDeps } from '../deps';
import type { Db } from '../../db/client';
import { AppError, ConflictError, NotFoundError, ValidationError } from '../lib/errors';
import {
  finishRespondent,
  getRespondentByToken,
  getStudyByPublicId,
  getStudyForAnswers,
  type RespondentRow,
} from '../../db/queries/respondents';
import { getAnswerByClientId, insertAnswer, listAnsweredKeys } from '../../db/queries/answers';
import {
  respondentPlanSchema,
  type AnswerReceipt,
  type AnswerValue,
  type RespondentScreen,
} from '../../shared/schemas/respondent';
import { screenKeys, type QuestionnairePage } from '../../shared/schemas/questionnaire';
import { closeIfDue, readSettings } from './lifecycle';
import { redirectFor } from './respondent-session';
import { buildScreens, loadFrozenVersion, type FrozenVersion } from './respondent-screens';
import { repeatedTaskNumber } from './respondent-plan';
import { checkAnswerValue, screensOut } from './answer-rules';

export type AnswerInput = {
  clientId: string;
  screenKey: string;
  value: AnswerValue;
  responseMs: number;
};

/** Row columns of an answer: choice tasks map the on-screen position back to the design. */
export function answerColumnsFor(
  screen: RespondentScreen,
  value: AnswerValue,
  repeatOfTask: number | null,
) {
  if (screen.kind !== 'task' || value.kind !== 'choice')
    return { taskNumber: null, chosenAlternative: null, chosenPosition: null, value };
  const chosen = screen.alternatives[value.position];
  return {
    taskNumber: screen.taskKind === 'design' ? Number(screen.key.slice('task:'.length)) : null,
    chosenAlternative: chosen.index,
    chosenPosition: value.position,
    value: {
      ...value,
      taskKind: screen.taskKind,
      ...(screen.taskKind === 'dominance' ? { dominantChosen: chosen.index === 0 } : {}),
      ...(repeatOfTask !== null ? { repeatOfTask } : {}),
    },
  };
}

/** The questionnaire page a (non-design-task) screen comes from. */
function pageOf(version: FrozenVersion, screenKey: string): QuestionnairePage | undefined {
  return version.questionnaire.pages.find((p) => {
    switch (p.kind) {
      case 'consent':
        return screenKey === screenKeys.consent();
      case 'question':
      case 'screening':
        return screenKey === screenKeys.question(p.question.key);
      case 'instructions':
        return screenKey === screenKeys.instructions(p.id);
      case 'warmup':
      case 'holdout':
      case 'repeat':
      case 'dominance':
        return screenKey === screenKeys.special(p.kind, p.id);
      default:
        return false;
    }
  });
}

const closedError = (status: string) =>
  status === 'draft'
    ? new AppError(409, 'survey_not_open', 'This survey is not open; answers are not accepted.')
    : new AppError(410, 'survey_closed', 'This survey has closed; answers are no longer accepted.');

type Outcome = { receipt: AnswerReceipt; completed: boolean } | { refuse: AppError };

/**
 * Records one answer for the respondent holding `sessionToken` in study `studyId`. The
 * respondent API and the demo seed both come through here.
 */
export async function saveAnswer(
  db: Db,
  params: { studyId: string; sessionToken: string; answer: AnswerInput; now?: Date },
): Promise<AnswerReceipt> {
  const now = params.now ?? new Date();
  const { answer } = params;
  const before = await getStudyForAnswers(db, { id: params.studyId });
  if (!before) throw new NotFoundError('Survey');
  const closeAt = readSettings(before.settings).closeAt;
  if (before.status === 'live' && closeAt && new Date(closeAt) <= now)
    await closeIfDue(db, before, now);

  const outcome: Outcome = await db.transaction(async (tx) => {
    const respondent = await getRespondentByToken(tx, {
      studyId: params.studyId,
      sessionToken: params.sessionToken,
      forUpdate: true,
    });
    if (!respondent) throw new NotFoundError('Session');
    const study = (await getStudyForAnswers(tx, { id: params.studyId }))!;
    const settings = readSettings(study.settings);
    const version = await loadFrozenVersion(tx, { id: respondent.versionId, studyId: study.id });
    const plan = respondentPlanSchema.parse(respondent.plan);
    const screens = buildScreens(version, plan);
    const answered = await listAnsweredKeys(tx, { respondentId: respondent.id });
    const receipt = (status: RespondentRow['status'], replay: boolean): AnswerReceipt => ({
      screenKey: answer.screenKey,
      nextScreenKey:
        status === 'in_progress' ? (screens.find((s) => !answered.has(s.key))?.key ?? null) : null,
      status,
      redirectUrl: redirectFor(settings, status, respondent.externalId),
      replay,
    });

    const earlier = await getAnswerByClientId(tx, {
      respondentId: respondent.id,
      clientId: answer.clientId,
    });
    if (earlier) {
      if (earlier.screenKey !== answer.screenKey)
        throw new ConflictError(
          'client_id_reused',
          'This answer id was already used for another screen.',
        );
      return { receipt: receipt(respondent.status, true), completed: false };
    }
    if (respondent.status === 'completed')
      throw new ConflictError(
        'already_completed',
        'This questionnaire is complete; no more answers can be added.',
      );
    if (respondent.status !== 'in_progress')
      throw new ConflictError(
        'already_finished',
        'This session has ended; no more answers can be added.',
      );
    if (study.status !== 'live') {
      if (study.status === 'closed' && settings.closedReason === 'quota') {
        const durationMs = now.getTime() - respondent.startedAt.getTime();
        await finishRespondent(tx, {
          id: respondent.id,
          status: 'over_quota',
          finishedAt: now,
          durationMs,
        });
        return {
          refuse: new AppError(
            410,
            'over_quota',
            'This survey has all the answers it needs. Thank you for your time.',
          ),
        };
      }
      throw closedError(study.status);
    }

    const screen = screens.find((s) => s.key === answer.screenKey);
    if (!screen)
      throw new ValidationError(
        'This screen is not part of your questionnaire.',
        [{ path: 'screenKey', message: 'Unknown screen' }],
        'unknown_screen',
      );
    if (answered.has(answer.screenKey))
      throw new ConflictError(
        'already_answered',
        'This screen already has an answer; it cannot be changed.',
      );
    const expected = screens.find((s) => !answered.has(s.key))!;
    if (expected.key !== answer.screenKey)
      throw new ConflictError(
        'out_of_order',
        `Answer the screens in order; the next one is "${expected.key}".`,
        [{ path: 'screenKey', message: `Expected ${expected.key}` }],
      );
    checkAnswerValue(screen, answer.value);

    const page = pageOf(version, screen.key);
    const repeatOf = page?.kind === 'repeat' ? repeatedTaskNumber(plan, page.repeatOf) : null;
    const inserted = await insertAnswer(tx, {
      respondentId: respondent.id,
      studyId: study.id,
      clientId: answer.clientId,
      screenKey: answer.screenKey,
      responseMs: answer.responseMs,
      createdAt: now,
      ...answerColumnsFor(screen, answer.value, repeatOf),
    });
    if (!inserted)
      throw new ConflictError('already_answered', 'This screen already has an answer.');
    answered.add(answer.screenKey);

    let status: RespondentRow['status'] = 'in_progress';
    if (page && screensOut(page, answer.value)) status = 'screened_out';
    else if (screens.every((s) => answered.has(s.key))) status = 'completed';
    if (status !== 'in_progress') {
      const durationMs = now.getTime() - respondent.startedAt.getTime();
      await finishRespondent(tx, { id: respondent.id, status, finishedAt: now, durationMs });
    }
    return { receipt: receipt(status, false), completed: status === 'completed' };
  });
  if ('refuse' in outcome) throw outcome.refuse;
  // The quota counts committed completes, so it is checked after this one is committed.
  if (outcome.completed && readSettings(before.settings).quotaCompletes !== null)
    await closeIfDue(db, before, now);
  return outcome.receipt;
}

/** The respondent API's entry: the public id names the study, the token the session. */
export async function submitAnswer(
  deps: AppDeps,
  publicId: string,
  sessionToken: string,
  answer: AnswerInput,
): Promise<AnswerReceipt> {
  const study = await getStudyByPublicId(deps.db, { publicId });
  if (!study || study.archivedAt)
    throw new AppError(404, 'survey_not_found', 'This survey link does not exist.');
  return saveAnswer(deps.db, { studyId: study.id, sessionToken, answer });
}
