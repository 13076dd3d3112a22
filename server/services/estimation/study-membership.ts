/**
 * Latent class runs of a study with class membership by background answers: the questions come
 * from the latest frozen questionnaire (the draft's before the study first goes live), are
 * checked when the run is created (400 naming spec.membership.<i>), and are coded for the run's
 * respondents when it runs (membership-covariates.ts).
 */
import type { DbOrTx } from '../../../db/client';
import { listQuestionAnswers } from '../../../db/queries/study-answers';
import { listStudyVersions } from '../../../db/queries/versions';
import type { EstimationSpec } from '../../../shared/schemas/estimation-spec';
import { MEMBERSHIP_MAX_OPTIONS } from '../../../shared/schemas/estimation-families';
import type { MembershipQuestionOption } from '../../../shared/schemas/run';
import type { MembershipCovariates } from '../../engine/latent-class/check-latent-class-options';
import { getBackgroundQuestions, indexAnswers } from '../tastes/background-answers';
import {
  buildMembershipCovariates,
  resolveMembershipQuestions,
  type MembershipQuestion,
} from './membership-covariates';

const membershipKeys = (spec: EstimationSpec) =>
  spec.model === 'latent_class' ? (spec.membership ?? []) : [];

async function getBackgroundQuestionsOf(
  db: DbOrTx,
  study: { id: string; questionnaire?: unknown },
): Promise<MembershipQuestion[]> {
  const versions = await listStudyVersions(db, { studyId: study.id });
  const latest = versions[versions.length - 1];
  return getBackgroundQuestions(latest ? latest.questionnaire : study.questionnaire);
}

async function getMembershipQuestions(
  db: DbOrTx,
  study: { id: string; questionnaire?: unknown },
  keys: readonly string[],
): Promise<MembershipQuestion[]> {
  return resolveMembershipQuestions(await getBackgroundQuestionsOf(db, study), keys);
}

/** The questions the Models form offers for class membership. */
export async function listMembershipQuestions(
  db: DbOrTx,
  study: { id: string; questionnaire?: unknown },
): Promise<MembershipQuestionOption[]> {
  return (await getBackgroundQuestionsOf(db, study)).flatMap((q) =>
    (q.type === 'single' && q.options.length <= MEMBERSHIP_MAX_OPTIONS) || q.type === 'number'
      ? [{ key: q.key, text: q.text, type: q.type, optionCount: q.options.length }]
      : [],
  );
}

/** Throws 400 unless every membership question of `spec` can be coded. */
export async function assertMembershipQuestions(
  db: DbOrTx,
  study: { id: string; questionnaire?: unknown },
  spec: EstimationSpec,
): Promise<void> {
  const keys = membershipKeys(spec);
  if (keys.length > 0) await getMembershipQuestions(db, study, keys);
}

/** The run's membership covariates (null without membership questions). */
export async function loadMembershipCovariates(
  db: DbOrTx,
  study: { id: string; questionnaire?: unknown },
  spec: EstimationSpec,
  respondentIds: readonly string[],
): Promise<MembershipCovariates | null> {
  const keys = membershipKeys(spec);
  if (keys.length === 0) return null;
  const questions = await getMembershipQuestions(db, study, keys);
  const answers = await listQuestionAnswers(db, { studyId: study.id, respondentIds });
  return buildMembershipCovariates(questions, respondentIds, indexAnswers(answers));
}
