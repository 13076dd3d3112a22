/**
 * Reading a translator's file (CSV or XLIFF 2.0) into its texts, each with the line it is on.
 * A file that is not what it claims to be, belongs to another study or carries another
 * language is refused whole with a field error (`file` or `language`).
 */
import { ValidationError } from '../../lib/errors';
import { readCsvText, type CsvRecord } from '../../lib/csv-dialect';
import { unescapeCsvText } from '../../lib/safe-csv';
import { languageName } from '../../../shared/languages/language-tags';
import { readXliff, XliffError } from './xliff';

/** One text of the file: its key, the note saying where it is met, the translation, its line. */
export type FileText = { key: string; where: string; target: string; line: number };

export function readCsvFile(content: string, source: string, lang: string): FileText[] {
  let records: CsvRecord[];
  try {
    // Every row must have the header's four columns.
    ({ records } = readCsvText(content, { trim: false, sameFieldCount: true }));
  } catch (err) {
    throw new ValidationError('The CSV file cannot be read', [
      { path: 'file', message: (err as Error).message },
    ]);
  }
  const [header, ...body] = records;
  if (!header || header.record[0] !== 'key' || header.record.length !== 4)
    throw new ValidationError(
      'This is not a translation file of this page: its first row must be key, where, source, target',
      [
        {
          path: 'file',
          message: `Line 1: expected the columns key, where, ${source}, ${lang}. Export a CSV file from this page and fill its last column.`,
        },
      ],
    );
  const [, , from, to] = header.record;
  if (from !== source || to !== lang)
    throw new ValidationError(`This file is for ${from} → ${to}, not ${source} → ${lang}`, [
      {
        path: 'language',
        message: `Export the ${languageName(lang)} file of this study and fill its last column`,
      },
    ]);
  return body.map(({ record, line }) => ({
    key: record[0] ?? '',
    where: record[1] ?? '',
    target: unescapeCsvText(record[3] ?? ''),
    line,
  }));
}

export function readXliffFile(
  content: string,
  studyId: string,
  source: string,
  lang: string,
): FileText[] {
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
      [
        {
          path: 'language',
          message: doc.trgLang
            ? `Import it into ${languageName(doc.trgLang)} instead`
            : 'Its <xliff> element names no trgLang',
        },
      ],
    );
  return doc.units.map((u) => ({ key: u.id, where: u.note, target: u.target, line: u.line ?? 0 }));
}
