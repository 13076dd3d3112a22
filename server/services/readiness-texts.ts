/**
 * Going live (and freezing a new design into a live study) needs every text in every language
 * of the study: a respondent must never meet a blank or a stray source-language line. The
 * problems name what is missing, by where respondents meet it.
 */
import type { ReadinessProblem } from '../../shared/schemas/study-lifecycle';
import { languageName } from '../../shared/languages/language-tags';
import type { StudyDocuments } from '../../shared/languages/study-text-keys';
import {
  findMissingTexts,
  findStaleTranslations,
  listStudyTexts,
  type StudyLanguages,
} from '../../shared/languages/study-texts';

/** Up to this many missing texts per language are listed one by one; beyond, summarised. */
const LISTED = 15;

export function checkStudyTexts(docs: StudyDocuments, langs: StudyLanguages): ReadinessProblem[] {
  return findMissingTexts(listStudyTexts(docs, langs), langs).flatMap(({ language, missing }) => {
    const name = languageName(language);
    if (missing.length <= LISTED)
      return missing.map((e) => ({
        code: 'missing_translation',
        path: `texts.${language}.${e.key}`,
        message: `${name} has no text for ${e.where} (${e.key}).`,
      }));
    const shown = missing
      .slice(0, 10)
      .map((e) => e.key)
      .join(', ');
    return [
      {
        code: 'missing_translation',
        path: `texts.${language}`,
        message: `${name} lacks ${missing.length} texts: ${shown} and ${missing.length - 10} more. See Questionnaire → Languages.`,
      },
    ];
  });
}

/**
 * Translations made from a source wording that has changed since: going live is not refused
 * (the translation may still hold), but each language's stale texts are listed as a warning.
 */
export function checkStaleTranslations(
  docs: StudyDocuments,
  langs: StudyLanguages,
): ReadinessProblem[] {
  const entries = listStudyTexts(docs, langs);
  const whereOf = new Map(entries.map((e) => [e.key, e.where]));
  return Object.entries(findStaleTranslations(entries, langs)).flatMap(([language, stale]) => {
    const keys = Object.keys(stale);
    if (keys.length === 0) return [];
    const shown = keys.slice(0, 5).map((k) => whereOf.get(k) ?? k);
    const more = keys.length > 5 ? ` and ${keys.length - 5} more` : '';
    return [
      {
        code: 'stale_translation',
        path: `texts.${language}`,
        message: `${languageName(language)}: ${keys.length} ${keys.length === 1 ? 'translation was' : 'translations were'} made from an earlier source wording: ${shown.join('; ')}${more}. Check ${keys.length === 1 ? 'it' : 'them'} on Questionnaire → Languages.`,
      },
    ];
  });
}
