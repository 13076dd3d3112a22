/**
 * Per-respondent downloads of study data: the background answers (status, inclusion, flags,
 * answers) and the history of changed answers. Questions marked personal, and external ids,
 * only for roles with 'personal:read'.
 */
import { getLatestVersion, listStudyVersions } from '../../../db/queries/versions';
import type { AppDeps } from '../../deps';
import { loadStudy } from '../study-access';
import { listQuestionAnswers } from '../../../db/queries/study-answers';
import { listStudyRespondents } from '../../../db/queries/study-respondents';
import { roleCan } from '../../../shared/permissions';
import {
  getBackgroundQuestions,
  indexAnswers,
  formatAnswer,
  getSkippedFlag,
  skippedColumnKey,
} from '../tastes/background-answers';
import { getFlagNames } from '../tastes/taste-rows';
import { writeCsv } from '../../lib/safe-csv';
import { listAnswerHistory, listRevisedAnswers } from '../../../db/queries/answer-revisions';
import { answerHistoryHeader, buildAnswerHistory, revisedScreensOf } from './answer-history';
import { makeDownload, type StudyExporter } from './download';
import { getInclusion } from './inclusion';
import type { Actor } from '../actor';

/** The study's respondents and the background questions this role may read. */
export async function loadRespondentTable(deps: AppDeps, actor: Actor, studyId: string) {
  const study = await loadStudy(deps, actor.teamId, studyId);
  const personal = roleCan(actor.role, 'personal:read');
  const version = await getLatestVersion(deps.db, { studyId });
  const questions = getBackgroundQuestions(version?.questionnaire ?? study.questionnaire).filter(
    (q) => personal || !q.personal,
  );
  const [respondents, versions] = await Promise.all([
    listStudyRespondents(deps.db, { studyId }),
    listStudyVersions(deps.db, { studyId }),
  ]);
  const versionNumber = new Map(versions.map((v) => [v.id, v.version]));
  return { study, personal, questions, respondents, versionNumber };
}

/** Every respondent with their status and background answers. */
export const exportAnswersCsv: StudyExporter = async (deps, actor, studyId, at = new Date()) => {
  const { study, personal, questions, respondents, versionNumber } = await loadRespondentTable(
    deps,
    actor,
    studyId,
  );
  const answers = indexAnswers(await listQuestionAnswers(deps.db, { studyId }));
  const revised = new Map<string, { screenKey: string; revisionCount: number }[]>();
  for (const r of await listRevisedAnswers(deps.db, { studyId }))
    revised.set(r.respondentId, [...(revised.get(r.respondentId) ?? []), r]);
  const header = [
    'respondent',
    'number',
    ...(personal ? ['external_id'] : []),
    'version',
    'block',
    'language',
    'status',
    'included',
    'exclusion',
    'quality_flags',
    'revised_screens',
    ...questions.flatMap((q) => (q.conditional ? [q.key, skippedColumnKey(q.key)] : [q.key])),
  ];
  const rows = respondents.map((r) => [
    r.id,
    r.number,
    ...(personal ? [r.externalId] : []),
    versionNumber.get(r.versionId) ?? null,
    r.block,
    r.language,
    r.status,
    getInclusion(r).included,
    getInclusion(r).exclusion,
    getFlagNames(r.flags).join('; '),
    revisedScreensOf(revised.get(r.id) ?? []),
    ...questions.flatMap((q) => {
      const value = answers.get(r.id)?.get(q.key);
      const answer = formatAnswer(q, value);
      return q.conditional ? [answer, getSkippedFlag(value)] : [answer];
    }),
  ]);
  return makeDownload(
    study.name,
    'background-answers',
    'csv',
    at,
    writeCsv(header, rows),
    personal,
  );
};

/**
 * Every answer of every screen a respondent went back to and changed, oldest first, the
 * current one marked (answers of questions the role may not read are left out).
 */
export const exportAnswerHistoryCsv: StudyExporter = async (
  deps,
  actor,
  studyId,
  at = new Date(),
) => {
  const { study, personal, questions, respondents } = await loadRespondentTable(
    deps,
    actor,
    studyId,
  );
  const numbers = new Map(respondents.map((r) => [r.id, r.number]));
  const [current, replaced] = await Promise.all([
    listRevisedAnswers(deps.db, { studyId }),
    listAnswerHistory(deps.db, { studyId }),
  ]);
  const rows = buildAnswerHistory(
    [...current.map((r) => ({ ...r, replacedAt: null })), ...replaced],
    numbers,
    questions,
  );
  return makeDownload(
    study.name,
    'answer-history',
    'csv',
    at,
    writeCsv(answerHistoryHeader, rows),
    personal,
  );
};
