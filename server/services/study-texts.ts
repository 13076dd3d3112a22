/**
 * A study's languages and translations: read every text with its translations, change the
 * list of languages, save one language's texts. Only drafts change; live and closed studies
 * keep the texts frozen in their version.
 */
import type { AppDeps } from '../deps';
import { ValidationError } from '../lib/errors';
import { recordAudit } from './audit';
import { getQuestionnaire } from './questionnaire';
import { loadDraftStudy } from './studies';
import { loadStudy } from './study-access';
import { updateDraftLanguages } from '../../db/queries/versions';
import { languageName } from '../../shared/languages/language-tags';
import type { StudyDocuments } from '../../shared/languages/study-text-keys';
import {
  findMissingTexts,
  findStaleTranslations,
  listStudyTexts,
  type StudyLanguages,
  type Translations,
} from '../../shared/languages/study-texts';
import { emptyStudyDefinition, studyDefinitionSchema } from '../../shared/schemas/study-definition';
import type { StudyTextsView } from '../../shared/schemas/study-texts';
import type { Actor } from './actor';

type StudyRow = Awaited<ReturnType<typeof loadStudy>>;

/** The documents respondents would see now (the default questionnaire until the first save). */
export async function loadStudyDocuments(deps: AppDeps, study: StudyRow): Promise<StudyDocuments> {
  const definition = studyDefinitionSchema.safeParse(study.definition);
  const q = await getQuestionnaire(deps, study.teamId, study.id);
  return {
    publicTitle: study.publicTitle,
    definition: definition.success ? definition.data : emptyStudyDefinition,
    questionnaire: q.questionnaire,
  };
}

export const languagesOf = (study: StudyRow): StudyLanguages => ({
  languages: study.languages,
  translations: study.translations,
  sources: study.translationSources,
});

/** Every text of the study as it stands now, with its translations and their state. */
export async function listCurrentStudyTexts(deps: AppDeps, study: StudyRow) {
  return listStudyTexts(await loadStudyDocuments(deps, study), languagesOf(study));
}

export async function getStudyTexts(
  deps: AppDeps,
  teamId: string,
  studyId: string,
): Promise<StudyTextsView> {
  const study = await loadStudy(deps, teamId, studyId);
  const langs = languagesOf(study);
  const texts = await listCurrentStudyTexts(deps, study);
  const missing = Object.fromEntries(langs.languages.map((l) => [l, 0]));
  for (const m of findMissingTexts(texts, langs)) missing[m.language] = m.missing.length;
  return {
    languages: langs.languages,
    editable: study.status === 'draft',
    texts,
    translations: langs.translations,
    missing,
    stale: findStaleTranslations(texts, langs),
  };
}

/**
 * Sets the study's languages. The first is the source language, the one the documents are
 * written in: it can be renamed (a study migrated as "en" that is really "en-GB" or "de"), but
 * not swapped with a language that holds translations, since the documents would not follow.
 * Translations of a removed language are deleted.
 */
export async function updateLanguages(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  languages: string[],
): Promise<StudyTextsView> {
  const { teamId } = actor;
  const study = await loadDraftStudy(deps, teamId, studyId, 'its languages');
  const [source, ...others] = study.languages;
  if (languages[0] !== source && others.includes(languages[0]))
    throw new ValidationError('The source language cannot be swapped with a translation', [
      {
        path: 'languages.0',
        message: `${languageName(languages[0])} is a translation of this study. The first language must stay the one the study is written in (${languageName(source)}); you may rename it.`,
      },
    ]);
  const translations: Translations = {};
  const sources: Translations = {};
  for (const lang of languages.slice(1)) {
    if (study.translations[lang]) translations[lang] = study.translations[lang];
    if (study.translationSources[lang]) sources[lang] = study.translationSources[lang];
  }
  // The source language keeps its own interface wordings under its (possibly new) tag.
  if (study.translations[source]) translations[languages[0]] = study.translations[source];
  await deps.db.transaction(async (tx) => {
    await updateDraftLanguages(tx, {
      id: studyId,
      teamId,
      languages,
      translations,
      translationSources: sources,
    });
    await recordAudit(tx, {
      teamId,
      actor,
      action: 'study.languages_changed',
      studyId,
      details: {
        study: study.name,
        languages,
        added: languages.filter((l) => !study.languages.includes(l)),
        removed: study.languages.filter((l) => !languages.includes(l)),
      },
    });
  });
  return getStudyTexts(deps, teamId, studyId);
}
