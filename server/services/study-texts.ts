/**
 * A study's languages and translations: read every text with its translations, change the
 * list of languages, save one language's texts. Only drafts change; live and closed studies
 * keep the texts frozen in their version.
 */
import type { AppDeps } from '../deps';
import { ValidationError, type FieldIssue } from '../lib/errors';
import { getQuestionnaire } from './questionnaire';
import { assertDraft } from './studies';
import { loadStudy } from './study-access';
import { updateDraftLanguages } from '../../db/queries/versions';
import { languageName } from '../../shared/languages/language-tags';
import type { StudyDocuments } from '../../shared/languages/study-text-keys';
import {
  findMissingTexts,
  isInterfaceKey,
  listStudyTexts,
  type StudyLanguages,
  type Translations,
} from '../../shared/languages/study-texts';
import { emptyStudyDefinition, studyDefinitionSchema } from '../../shared/schemas/study-definition';
import type { StudyTextsView } from '../../shared/schemas/study-texts';

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
});

export async function getStudyTexts(
  deps: AppDeps,
  teamId: string,
  studyId: string,
): Promise<StudyTextsView> {
  const study = await loadStudy(deps, teamId, studyId);
  const langs = languagesOf(study);
  const texts = listStudyTexts(await loadStudyDocuments(deps, study), langs);
  const missing = Object.fromEntries(langs.languages.map((l) => [l, 0]));
  for (const m of findMissingTexts(texts, langs)) missing[m.language] = m.missing.length;
  return {
    languages: langs.languages,
    editable: study.status === 'draft',
    texts,
    translations: langs.translations,
    missing,
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
  teamId: string,
  studyId: string,
  languages: string[],
): Promise<StudyTextsView> {
  const study = await loadStudy(deps, teamId, studyId);
  assertDraft(study, 'its languages');
  const [source, ...others] = study.languages;
  if (languages[0] !== source && others.includes(languages[0]))
    throw new ValidationError('The source language cannot be swapped with a translation', [
      {
        path: 'languages.0',
        message: `${languageName(languages[0])} is a translation of this study. The first language must stay the one the study is written in (${languageName(source)}); you may rename it.`,
      },
    ]);
  const translations: Translations = {};
  for (const lang of languages.slice(1))
    if (study.translations[lang]) translations[lang] = study.translations[lang];
  // The source language keeps its own interface wordings under its (possibly new) tag.
  if (study.translations[source]) translations[languages[0]] = study.translations[source];
  await updateDraftLanguages(deps.db, {
    id: studyId,
    teamId: teamId,
    languages,
    translations,
  });
  return getStudyTexts(deps, teamId, studyId);
}

/**
 * Checks texts for one language against the study's keys: unknown keys, and source-language
 * texts that belong in the documents (the source language holds only the app's words).
 */
export function checkTranslationKeys(
  keys: Iterable<string>,
  known: Set<string>,
  isSource: boolean,
  prefix = 'texts',
): FieldIssue[] {
  const issues: FieldIssue[] = [];
  for (const key of keys) {
    if (!known.has(key))
      issues.push({ path: `${prefix}.${key}`, message: `${key} is not a text of this study` });
    else if (isSource && !isInterfaceKey(key))
      issues.push({
        path: `${prefix}.${key}`,
        message: `${key} is written in the source language on Attributes or Questionnaire`,
      });
  }
  return issues;
}

/** Saves texts of one language (an empty text removes it); nothing is saved on any problem. */
export async function saveTranslations(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  lang: string,
  texts: Record<string, string>,
): Promise<StudyTextsView> {
  const study = await loadStudy(deps, teamId, studyId);
  assertDraft(study, 'its texts');
  await writeTranslations(deps, study, lang, texts);
  return getStudyTexts(deps, teamId, studyId);
}

/** The shared write of the form and the file import: validated first, all or nothing. */
export async function writeTranslations(
  deps: AppDeps,
  study: StudyRow,
  lang: string,
  texts: Record<string, string>,
): Promise<void> {
  if (!study.languages.includes(lang))
    throw new ValidationError(`${languageName(lang)} is not a language of this study`, [
      { path: 'lang', message: `Add ${languageName(lang)} to the study's languages first` },
    ]);
  const entries = listStudyTexts(await loadStudyDocuments(deps, study), languagesOf(study));
  const issues = checkTranslationKeys(
    Object.keys(texts),
    new Set(entries.map((e) => e.key)),
    lang === study.languages[0],
  );
  if (issues.length) throw new ValidationError(issues[0].message, issues);
  const next = { ...(study.translations[lang] ?? {}) };
  for (const [key, text] of Object.entries(texts)) {
    const value = text.trim();
    if (value) next[key] = value;
    else delete next[key];
  }
  const updated = await updateDraftLanguages(deps.db, {
    id: study.id,
    teamId: study.teamId,
    languages: study.languages,
    translations: { ...study.translations, [lang]: next },
  });
  if (!updated) assertDraft({ status: 'live' }, 'its texts');
}
