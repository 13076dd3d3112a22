/**
 * A study's texts as files for translators: XLIFF 2.0 (xliff.ts) or CSV (key, where, source
 * language, target language). An import is checked whole before anything is written: the
 * wrong study or language is refused with a field error, and the answer reports the study's
 * keys the file lacks (or leaves empty) and the file's keys the study does not have.
 */
import type { AppDeps } from '../../deps';
import { ValidationError, type FieldIssue } from '../../lib/errors';
import { writeCsv } from '../../lib/safe-csv';
import { languageName } from '../../../shared/languages/language-tags';
import { isInterfaceKey } from '../../../shared/languages/study-texts';
import {
  MAX_TRANSLATION_LENGTH,
  type TranslationFormat,
  type TranslationImportReport,
} from '../../../shared/schemas/study-texts';
import { loadStudy } from '../study-access';
import { loadDraftStudy } from '../studies';
import type { Actor } from '../actor';
import { languagesOf, listCurrentStudyTexts } from '../study-texts';
import { writeTranslations } from './save-translations';
import { readCsvFile, readXliffFile, type FileText } from './translation-file-readers';
import { writeXliff } from './xliff';

type Download = { filename: string; contentType: string; body: string };

const slug = (name: string) =>
  name
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '')
    .slice(0, 40) || 'study';

function assertTranslation(languages: string[], lang: string) {
  if (!languages.includes(lang))
    throw new ValidationError(`${languageName(lang)} is not a language of this study`, [
      { path: 'lang', message: `Add ${languageName(lang)} to the study's languages first` },
    ]);
  if (lang === languages[0])
    throw new ValidationError('Files carry translations, not the source language', [
      { path: 'lang', message: `${languageName(lang)} is the language the study is written in` },
    ]);
}

export async function exportTranslationFile(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  lang: string,
  format: TranslationFormat,
): Promise<Download> {
  const study = await loadStudy(deps, teamId, studyId);
  const langs = languagesOf(study);
  assertTranslation(langs.languages, lang);
  const source = langs.languages[0];
  const own = langs.translations[lang] ?? {};
  const entries = await listCurrentStudyTexts(deps, study);
  const name = `${slug(study.name)}-texts-${source}-${lang}`;
  if (format === 'csv')
    return {
      filename: `${name}.csv`,
      contentType: 'text/csv; charset=utf-8',
      body: writeCsv(
        ['key', 'where', source, lang],
        entries.map((e) => [e.key, e.where, e.source, own[e.key] ?? '']),
      ),
    };
  return {
    filename: `${name}.xlf`,
    contentType: 'application/xliff+xml; charset=utf-8',
    body: writeXliff({
      srcLang: source,
      trgLang: lang,
      fileId: study.id,
      units: entries.map((e) => ({
        id: e.key,
        note: e.where,
        source: e.source,
        target: own[e.key] ?? '',
      })),
    }),
  };
}

/** Refusals listed one by one; a file with more is refused with the first ones. */
const LISTED = 50;

/**
 * Texts the file cannot give, by line: a key given twice (which one would be meant?), a text
 * longer than a field takes, a unit without a key. Any of them refuses the whole file.
 */
function refusals(texts: FileText[]): FieldIssue[] {
  const issues: FieldIssue[] = [];
  const firstLine = new Map<string, number>();
  for (const t of texts) {
    const at = `Line ${t.line}`;
    if (!t.key) issues.push({ path: 'file', message: `${at}: a text without a key` });
    else if (firstLine.has(t.key))
      issues.push({
        path: `texts.${t.key}`,
        message: `${at}: ${t.key} is given again (first on line ${firstLine.get(t.key)})`,
      });
    else firstLine.set(t.key, t.line);
    if (t.target.trim().length > MAX_TRANSLATION_LENGTH)
      issues.push({
        path: `texts.${t.key}`,
        message: `${at}: the text of ${t.key} has ${t.target.trim().length.toLocaleString('en')} characters; at most ${MAX_TRANSLATION_LENGTH.toLocaleString('en')}`,
      });
  }
  return issues.slice(0, LISTED);
}

/** Imports a translator's file into one language: all of its known texts, or nothing. */
export async function importTranslationFile(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  lang: string,
  input: { format: TranslationFormat; content: string },
): Promise<TranslationImportReport> {
  const { teamId } = actor;
  const study = await loadDraftStudy(deps, teamId, studyId, 'its texts');
  const langs = languagesOf(study);
  assertTranslation(langs.languages, lang);
  const source = langs.languages[0];
  const file =
    input.format === 'csv'
      ? readCsvFile(input.content, source, lang)
      : readXliffFile(input.content, study.id, source, lang);
  if (file.length === 0)
    throw new ValidationError('The file holds no texts', [
      { path: 'file', message: 'Export this study’s file, translate it and import that one' },
    ]);
  const refused = refusals(file);
  if (refused.length)
    throw new ValidationError(
      `Nothing was imported: ${refused.length === LISTED ? 'at least ' : ''}${refused.length} ${refused.length === 1 ? 'text' : 'texts'} of the file cannot be taken`,
      refused,
    );
  const entries = await listCurrentStudyTexts(deps, study);
  const known = new Set(entries.map((e) => e.key));
  const extra = file.filter((t) => !known.has(t.key));
  if (extra.length === file.length)
    throw new ValidationError('None of the file’s texts belongs to this study', [
      {
        path: 'file',
        message: 'Is it another study’s file? Export this study’s file and translate that one',
      },
    ]);
  const texts: Record<string, string> = {};
  for (const t of file) if (known.has(t.key) && t.target.trim()) texts[t.key] = t.target;
  const stored = { ...(langs.translations[lang] ?? {}), ...texts };
  const report: TranslationImportReport = {
    imported: Object.keys(texts).length,
    missing: entries
      .filter((e) => !stored[e.key]?.trim())
      .map((e) => ({ key: e.key, where: e.where, interface: isInterfaceKey(e.key) })),
    extra: extra.map((t) => ({ key: t.key, where: t.where, line: t.line })),
  };
  if (report.imported > 0)
    await writeTranslations(deps, study, lang, texts, actor, {
      action: 'study.translations_imported',
      details: {
        format: input.format,
        imported: report.imported,
        missing: report.missing.length,
        extra: report.extra.length,
      },
    });
  return report;
}
