/**
 * The Preview section: the study as one respondent would walk through it, built by the same
 * functions as a live session (createRespondentPlan, buildSurveyView) from the study's
 * current definition, design and questionnaire (the default questionnaire until one is
 * saved). A block and a seed pick the respondent, so a preview can be compared with a live
 * session of the same block and seed.
 */
import type { AppDeps } from '../deps';
import { ConflictError } from '../lib/errors';
import { loadStudy } from './study-access';
import { createRespondentPlan } from './respondent-plan';
import type { FrozenVersion } from './respondent-screens';
import { buildSurveyView } from './survey-view';
import { getDesignById } from '../../db/queries/designs';
import { designSchema } from '../../shared/schemas/design';
import { questionnaireSchema } from '../../shared/schemas/questionnaire';
import { defaultQuestionnaire } from '../../shared/schemas/questionnaire-defaults';
import { studyDefinitionSchema } from '../../shared/schemas/study-definition';
import type { StudyPreview } from '../../shared/schemas/respondent';
import { localizeVersion } from './respondent-language';

export async function getStudyPreview(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  query: { block: number; seed: number; lang?: string },
): Promise<StudyPreview> {
  const study = await loadStudy(deps, teamId, studyId);
  const definition = studyDefinitionSchema.safeParse(study.definition);
  if (!definition.success || definition.data.attributes.length === 0)
    throw new ConflictError('nothing_to_preview', 'Add and save the attributes first.');
  const row = study.currentDesignId
    ? await getDesignById(deps.db, { id: study.currentDesignId, teamId })
    : null;
  const design = designSchema.safeParse(row?.design);
  if (!design.success)
    throw new ConflictError('nothing_to_preview', 'Create the choice tasks on the Tasks section.');
  const stored = questionnaireSchema.safeParse(study.questionnaire);
  const version: FrozenVersion = {
    id: 'preview',
    studyId,
    version: 0,
    definition: definition.data,
    design: design.data,
    questionnaire: stored.success ? stored.data : defaultQuestionnaire(definition.data),
    languages: study.languages,
    translations: study.translations,
  };
  const block = Math.min(query.block, design.data.blocks);
  const plan = createRespondentPlan({ ...version, block, seed: query.seed });
  return {
    block,
    blocks: design.data.blocks,
    seed: query.seed,
    questionnaireSaved: stored.success,
    // Texts a language still lacks show in the source language (going live needs them all).
    survey: (() => {
      const local = localizeVersion(version, study.publicTitle, query.lang ?? study.languages[0]);
      return buildSurveyView(local.version, plan, local.title);
    })(),
  };
}
