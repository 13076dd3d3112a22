import { useEffect } from 'react';

/**
 * Puts the respondent's language and writing direction on the document itself (<html lang
 * dir>), so the browser picks fonts, hyphenation and the reading order, and logical CSS
 * (ms-/me-, start/end) mirrors the whole page for right-to-left languages.
 */
export function useDocumentLanguage(language: string | null, dir: 'ltr' | 'rtl' | null) {
  useEffect(() => {
    if (!language || !dir) return;
    const html = document.documentElement;
    const before = { lang: html.lang, dir: html.dir };
    html.lang = language;
    html.dir = dir;
    return () => {
      html.lang = before.lang;
      html.dir = before.dir;
    };
  }, [language, dir]);
}
