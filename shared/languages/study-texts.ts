/**
 * A study's texts across its languages: the documents' own texts are the source language (the
 * first of the study's languages); the other languages, and the source language's interface
 * wordings when it is not English, live in `translations[language][key]`.
 */
import {
  englishInterfaceTexts,
  interfaceTextKeys,
  interfaceTexts,
  type InterfaceTexts,
} from './interface-texts';
import {
  listDocumentTexts,
  mapStudyTexts,
  type StudyDocuments,
  type StudyTextEntry,
} from './study-text-keys';

export type Translations = Record<string, Record<string, string>>;
export type StudyLanguages = {
  languages: string[];
  translations: Translations;
  /** language → key → the source wording each translation was made from (drafts only). */
  sources?: Translations;
};

export const isInterfaceKey = (key: string) => key.startsWith('ui.');

const isEnglish = (tag: string) => {
  try {
    return new Intl.Locale(tag).language === 'en';
  } catch {
    return false;
  }
};

/** Every text of the study with its source-language wording (documents, then the app's words). */
export function listStudyTexts(docs: StudyDocuments, langs: StudyLanguages): StudyTextEntry[] {
  const source = langs.languages[0];
  const own = langs.translations[source] ?? {};
  return [
    ...listDocumentTexts(docs),
    ...interfaceTextKeys.map((key) => ({
      key,
      where: `Survey app: ${interfaceTexts[key].where}`,
      source: own[key]?.trim() || (isEnglish(source) ? interfaceTexts[key].en : ''),
      long: 'long' in interfaceTexts[key],
    })),
  ];
}

/** The wording of one text in one language ('' when it has none yet). */
export function textIn(entry: StudyTextEntry, lang: string, langs: StudyLanguages): string {
  if (lang === langs.languages[0]) return entry.source;
  return langs.translations[lang]?.[entry.key]?.trim() ?? '';
}

/** Per language, the texts it still lacks (only languages that lack something appear). */
export function findMissingTexts(
  entries: StudyTextEntry[],
  langs: StudyLanguages,
): Array<{ language: string; missing: StudyTextEntry[] }> {
  return langs.languages.flatMap((language) => {
    const missing = entries.filter((e) => textIn(e, language, langs) === '');
    return missing.length ? [{ language, missing }] : [];
  });
}

/**
 * Per translation language, the translations made from a source wording that has changed
 * since: key → the wording they were made from. Translations saved before sources were
 * recorded have none, and are not flagged.
 */
export function findStaleTranslations(
  entries: StudyTextEntry[],
  langs: StudyLanguages,
): Record<string, Record<string, string>> {
  return Object.fromEntries(
    langs.languages.slice(1).map((language) => {
      const made = langs.sources?.[language] ?? {};
      const stale = entries.filter(
        (e) =>
          textIn(e, language, langs) !== '' &&
          made[e.key] !== undefined &&
          made[e.key] !== e.source,
      );
      return [language, Object.fromEntries(stale.map((e) => [e.key, made[e.key]]))];
    }),
  );
}

/**
 * The documents and the app's words in one language. A text the language lacks falls back to
 * the source wording: only drafts (the Preview) can lack any, since going live needs them all.
 */
export function localizeStudy(
  docs: StudyDocuments,
  langs: StudyLanguages,
  lang: string,
): { docs: StudyDocuments; ui: InterfaceTexts } {
  const own = langs.translations[lang] ?? {};
  const pick = (key: string, source: string) =>
    lang === langs.languages[0] ? source : own[key]?.trim() || source;
  const ui = Object.fromEntries(
    listStudyTexts(docs, langs)
      .filter((e) => isInterfaceKey(e.key))
      .map((e) => [e.key, pick(e.key, e.source) || englishInterfaceTexts[e.key as never]]),
  ) as InterfaceTexts;
  return { docs: mapStudyTexts(docs, (e) => pick(e.key, e.source)), ui };
}
