/**
 * The language a respondent answers in: set by the link (?lang=) when the session starts, or
 * chosen on the first screen before any answer, and stored with the session. Their version is
 * written into that language once per process (versions never change).
 */
import { AppError } from '../lib/errors';
import {
  canonicalLanguageTag,
  languageName,
  textDirection,
} from '../../shared/languages/language-tags';
import {
  englishInterfaceTexts,
  type InterfaceTextKey,
} from '../../shared/languages/interface-texts';
import type { StoredLanguages } from '../../shared/schemas/respondent';
import { localizeStudy } from '../../shared/languages/study-texts';
import type { FrozenVersion } from './respondent-screens';

const sourceOf = (version: FrozenVersion) => (version.languages ?? ['en'])[0];

/**
 * The language a link asks for, checked against the version's languages: absent means the
 * source language; an unknown or unoffered tag is a 400 naming the field.
 */
export function languageFromLink(version: FrozenVersion, raw: string | undefined): string {
  if (raw === undefined || raw === '') return sourceOf(version);
  const tag = canonicalLanguageTag(raw);
  if (!tag || !(version.languages ?? ['en']).includes(tag))
    throw new AppError(400, 'unknown_language', 'This survey is not offered in that language.', [
      {
        path: 'params.lang',
        message: `Offered: ${(version.languages ?? ['en']).map(languageName).join(', ')}`,
      },
    ]);
  return tag;
}

const cache = new Map<string, { version: FrozenVersion; title: string }>();
const CACHE_LIMIT = 400;

/** The version (and the public title) written in one language; the source returns itself. */
export function localizeVersion(
  version: FrozenVersion,
  publicTitle: string,
  language: string,
): { version: FrozenVersion; title: string } {
  const languages = version.languages ?? ['en'];
  const lang = languages.includes(language) ? language : languages[0];
  // One language and no words of its own: the documents as they are, the app's English words.
  if (languages.length === 1 && !version.translations?.[lang])
    return { version, title: publicTitle };
  const key = `${version.id}\u0000${lang}\u0000${publicTitle}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const { docs, ui } = localizeStudy(
    { publicTitle, definition: version.definition, questionnaire: version.questionnaire },
    { languages, translations: version.translations ?? {} },
    lang,
  );
  const entry = {
    version: {
      ...version,
      definition: docs.definition,
      questionnaire: docs.questionnaire,
      language: lang,
      ui,
    },
    title: docs.publicTitle,
  };
  // Drafts (the Preview) change under the same id: keep only live versions.
  if (version.id !== 'preview') {
    if (cache.size >= CACHE_LIMIT) cache.delete(cache.keys().next().value!);
    cache.set(key, entry);
  }
  return entry;
}

/**
 * The words of a page shown before any session (the survey closed or full) in the language
 * the link asks for, when the study offers it; else in the study's source language. Going
 * live needs every text in every language, so a version's own words are complete; versions
 * frozen before languages existed have none and keep the app's English words.
 */
export function pageBeforeSession(
  version: StoredLanguages,
  publicTitle: string,
  raw: string | undefined,
  keys: { title: InterfaceTextKey; body: InterfaceTextKey },
) {
  const languages = version.languages ?? ['en'];
  const asked = raw ? canonicalLanguageTag(raw) : null;
  const lang = asked && languages.includes(asked) ? asked : languages[0];
  const own = version.translations?.[lang] ?? {};
  const word = (key: InterfaceTextKey) => own[key]?.trim() || englishInterfaceTexts[key];
  return {
    language: lang,
    dir: textDirection(lang),
    studyName: (lang !== languages[0] && own['study.title']?.trim()) || publicTitle,
    texts: { title: word(keys.title), body: word(keys.body) },
  };
}
