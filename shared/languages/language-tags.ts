/**
 * Language tags (BCP 47, RFC 5646) of a study's questionnaire: canonical form, a readable name
 * and the writing direction. Validation and canonical casing come from the platform's Intl
 * (ECMA-402: Intl.getCanonicalLocales, Intl.DisplayNames), the same on server and phone.
 */

/** Scripts written right to left (ISO 15924 codes, Unicode CLDR script metadata). */
const RTL_SCRIPTS = new Set([
  'Arab',
  'Hebr',
  'Thaa',
  'Syrc',
  'Nkoo',
  'Adlm',
  'Rohg',
  'Mand',
  'Samr',
  'Mend',
]);

const names = new Intl.DisplayNames(['en'], { type: 'language', fallback: 'none' });

/** The canonical form of a tag ("pt-br" → "pt-BR"), or null when it is not a known language. */
export function canonicalLanguageTag(raw: string): string | null {
  let tag: string;
  try {
    [tag] = Intl.getCanonicalLocales(raw.trim());
  } catch {
    return null;
  }
  if (!tag) return null;
  try {
    // Private-use and unknown language subtags have no name: refuse them.
    return names.of(new Intl.Locale(tag).language) ? tag : null;
  } catch {
    return null;
  }
}

/** "German (de)" — how the researcher app names a language. */
export function languageName(tag: string): string {
  let name: string | undefined;
  try {
    name = names.of(tag);
  } catch {
    name = undefined;
  }
  return name ? `${name} (${tag})` : tag;
}

/**
 * Remembers a function of a language tag: building Intl objects costs far more than a lookup,
 * and every respondent session names its languages again. Bounded, as tags come from links.
 */
function perTag<T>(of: (tag: string) => T): (tag: string) => T {
  const known = new Map<string, T>();
  return (tag) => {
    let value = known.get(tag);
    if (value === undefined) {
      value = of(tag);
      if (known.size >= 500) known.clear();
      known.set(tag, value);
    }
    return value;
  };
}

/** The language's own name for itself ("Deutsch", "العربية"), for the respondent's chooser. */
export const nativeLanguageName = perTag((tag: string): string => {
  try {
    return new Intl.DisplayNames([tag], { type: 'language', fallback: 'code' }).of(tag) ?? tag;
  } catch {
    return tag;
  }
});

/** 'rtl' for languages whose (likely) script is written right to left. */
export const textDirection = perTag((tag: string): 'ltr' | 'rtl' => {
  try {
    const script = new Intl.Locale(tag).maximize().script;
    return script && RTL_SCRIPTS.has(script) ? 'rtl' : 'ltr';
  } catch {
    return 'ltr';
  }
});
