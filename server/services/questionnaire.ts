/**
 * The questionnaire of a study: read (a default one until the first save) and save while the
 * study is a draft. Live and closed studies keep the questionnaire frozen in their version.
 */
import type { AppDeps } from '../deps';
import { ConflictError } from '../lib/errors';
import { loadStudy } from './study-access';
import { updateDraftQuestionnaire } from '../../db/queries/versions';
import { questionnaireSchema, type Questionnaire } from '../../shared/schemas/questionnaire';
import { defaultQuestionnaire } from '../../shared/schemas/questionnaire-defaults';
import { emptyStudyDefinition, studyDefinitionSchema } from '../../shared/schemas/study-definition';

export type QuestionnaireView = {
  questionnaire: Questionnaire;
  /** False while the study still shows the default questionnaire (never saved). */
  saved: boolean;
  editable: boolean;
};

const frozen = (status: string) =>
  new ConflictError(
    'study_frozen',
    `This study is ${status}: its questionnaire cannot change. ${status === 'live' ? 'Close it, then return it to draft' : 'Return it to draft'} to edit.`,
  );

export async function getQuestionnaire(
  deps: AppDeps,
  teamId: string,
  studyId: string,
): Promise<QuestionnaireView> {
  const study = await loadStudy(deps, teamId, studyId);
  const stored = questionnaireSchema.safeParse(study.questionnaire);
  const definition = studyDefinitionSchema.safeParse(study.definition);
  return {
    questionnaire: stored.success
      ? stored.data
      : defaultQuestionnaire(definition.success ? definition.data : emptyStudyDefinition),
    saved: stored.success,
    editable: study.status === 'draft',
  };
}

export async function saveQuestionnaire(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  questionnaire: Questionnaire,
): Promise<QuestionnaireView> {
  const study = await loadStudy(deps, teamId, studyId);
  if (study.status !== 'draft') throw frozen(study.status);
  const row = await updateDraftQuestionnaire(deps.db, { id: studyId, teamId, questionnaire });
  if (!row) throw frozen('live');
  return { questionnaire, saved: true, editable: true };
}
