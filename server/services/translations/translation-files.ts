/**
 * A study's texts as files for translators: XLIFF 2.0 (xliff.ts) or CSV (key, where, source
 * language, target language). An import is checked whole before anything is written: the
 * wrong study or language is refused with a field error, and the answer reports the study's
 * keys the file lacks (or leaves empty) and the file's keys the study does not have.
 */
import { parse } from 'csv-parse/sync';
import type { AppDeps } from '../../deps';
import { ValidationError } from '../../lib/errors';
import { unescapeCsvText, writeCsv } from '../../lib/safe-csv';
import { languageName } from '../../../shared/languages/language-tags';
import { isInterfaceKey, listStudyTexts } from '../../../shared/languages/study-texts';
import type {
  TranslationFormat,
  TranslationImportReport,
} from '../../../shared/schemas/study-texts';
import { loadStudy } from '../study-access';
import { assertDraft } from '../studies';
import { languagesOf, loadStudyDocuments, writeTranslations } from '../study-texts';
import { readXliff, writeXliff, XliffError } from './xliff';

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
  const entries = listStudyTexts(await loadStudyDocuments(deps, study), langs);
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

type FileTexts = { targets: Map<string, string> };

function readCsvFile(content: string, source: string, lang: string): FileTexts {
  let rows: string[][];
  try {
    rows = parse(content, { bom: true, relax_column_count: false, skip_empty_lines: true });
  } catch (err) {
    throw new ValidationError('The CSV file cannot be read', [
      { path: 'file', message: (err as Error).message },
    ]);
  }
  const [header, ...body] = rows;
  if (!header || header[0] !== 'key' || header.length !== 4)
    throw new ValidationError('The CSV file needs the columns key, where, source, target', [
      { path: 'file', message: 'The first row must be: key, where, <source language>, <language>' },
    ]);
  if (header[2] !== source || header[3] !== lang)
    throw new ValidationError(
      `This file is for ${header[2]} → ${header[3]}, not ${source} → ${lang}`,
      [
        {
          path: 'language',
          message: `Export the ${languageName(lang)} file of this study and fill its last column`,
        },
      ],
    );
  return { targets: new Map(body.map((r) => [r[0], unescapeCsvText(r[3] ?? '')])) };
}

function readXliffFile(content: string, studyId: string, source: string, lang: string): FileTexts {
  let doc;
  try {
    doc = readXliff(content);
  } catch (err) {
    if (!(err instanceof XliffError)) throw err;
    throw new ValidationError('The XLIFF file cannot be read', [
      { path: 'file', message: err.line ? `Line ${err.line}: ${err.message}` : err.message },
    ]);
  }
  if (doc.fileId !== studyId)
    throw new ValidationError('This file belongs to another study', [
      { path: 'file', message: 'Its <file id> is not this study: export this study’s file' },
    ]);
  if (doc.srcLang !== source || doc.trgLang !== lang)
    throw new ValidationError(
      `This file is for ${doc.srcLang || '?'} → ${doc.trgLang || '?'}, not ${source} → ${lang}`,
      [{ path: 'language', message: `Import it into ${languageName(doc.trgLang)} instead` }],
    );
  return { targets: new Map(doc.units.map((u) => [u.id, u.target])) };
}

/** Imports a translator's file into one language: all of its known texts, or nothing. */
export async function importTranslationFile(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  lang: string,
  input: { format: TranslationFormat; content: string },
): Promise<TranslationImportReport> {
  const study = await loadStudy(deps, teamId, studyId);
  assertDraft(study, 'its texts');
  const langs = languagesOf(study);
  assertTranslation(langs.languages, lang);
  const source = langs.languages[0];
  const file =
    input.format === 'csv'
      ? readCsvFile(input.content, source, lang)
      : readXliffFile(input.content, study.id, source, lang);
  const entries = listStudyTexts(await loadStudyDocuments(deps, study), langs);
  const known = new Set(entries.map((e) => e.key));
  const extra = [...file.targets.keys()].filter((k) => !known.has(k));
  if (extra.length === file.targets.size && file.targets.size > 0)
    throw new ValidationError('None of the file’s texts belongs to this study', [
      {
        path: 'file',
        message: 'Is it another study’s file? Export this study’s file and translate that one',
      },
    ]);
  const texts: Record<string, string> = {};
  for (const [key, target] of file.targets)
    if (known.has(key) && target.trim()) texts[key] = target;
  if (Object.keys(texts).length > 0) await writeTranslations(deps, study, lang, texts);
  const stored = { ...(langs.translations[lang] ?? {}), ...texts };
  return {
    imported: Object.keys(texts).length,
    missing: entries
      .filter((e) => !stored[e.key]?.trim())
      .map((e) => ({ key: e.key, where: e.where, interface: isInterfaceKey(e.key) })),
    extra,
  };
}
