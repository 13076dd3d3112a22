/**
 * The language a respondent answers in: set by the link (?lang=) when the session starts, or
 * chosen on the first screen before any answer, and stored with the session. Their version is
 * written into that language once per process (versions never change).
 */
import { AppError } from '../lib/errors';
import { canonicalLanguageTag, languageName } from '../../shared/languages/language-tags';
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
