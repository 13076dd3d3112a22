/**
 * Translation files for one language: download the study's texts as XLIFF 2.0 or CSV for a
 * translator, and import the translated file back. The file is read in the browser as text
 * and checked whole on the server; the report (or the refusal) stays on the page.
 */
import { useState } from 'react';
import { Card } from '@/components/ui/feedback';
import { FilePickButton } from '@/components/ui/file-pick-button';
import { languageName } from '@shared/languages/language-tags';
import { decodeText } from '@shared/text/decode-text';
import type { TranslationFormat, TranslationImportReport } from '@shared/schemas/study-texts';
import { translationFileHref, useImportTranslations } from '../api/import-translations';
import { ImportRefusal, ImportReport } from './import-report';

/** The API takes at most 2 MB of text (shared/schemas/study-texts.ts). */
const MAX_BYTES = 2_000_000;

/** The format a file is by its name; null for anything that is neither XLIFF nor CSV. */
export function translationFormatOf(fileName: string): TranslationFormat | null {
  const ext = /\.([a-z0-9]+)$/i.exec(fileName)?.[1]?.toLowerCase();
  if (ext === 'xlf' || ext === 'xliff' || ext === 'xml') return 'xliff';
  if (ext === 'csv') return 'csv';
  return null;
}

type Props = {
  teamId: string;
  studyId: string;
  lang: string;
  canImport: boolean;
};

const linkClass =
  'inline-flex h-8 items-center rounded-md border border-line bg-white px-3 text-sm font-medium text-ink hover:border-primary hover:text-primary';

export function TranslationFilesCard({ teamId, studyId, lang, canImport }: Props) {
  const name = languageName(lang);
  const importer = useImportTranslations(teamId, studyId);
  const [report, setReport] = useState<TranslationImportReport | null>(null);
  const [refusal, setRefusal] = useState<Error | null>(null);

  const onFile = async (file: File | undefined) => {
    if (!file) return;
    setReport(null);
    setRefusal(null);
    const format = translationFormatOf(file.name);
    if (!format)
      return setRefusal(
        new Error(
          `“${file.name}” is not an XLIFF (.xlf) or CSV (.csv) file. Export one above, translate it and import it here.`,
        ),
      );
    if (file.size > MAX_BYTES) return setRefusal(new Error(`“${file.name}” is larger than 2 MB.`));
    try {
      const content = decodeText(new Uint8Array(await file.arrayBuffer()));
      setReport(await importer.mutateAsync({ lang, format, content }));
    } catch (err) {
      setRefusal(err as Error);
    }
  };

  return (
    <Card title={`Translation files for ${name}`}>
      <p className="mb-3 text-sm text-ink-soft">
        Give a translator every text of the study in one file: XLIFF 2.0 for translation tools, or
        CSV for a spreadsheet (fill the last column). Importing takes the file’s texts, all or
        nothing, and reports what is still missing.
      </p>
      <div className="flex flex-wrap items-center gap-2">
        {(['xliff', 'csv'] as const).map((format) => (
          <a
            key={format}
            className={linkClass}
            href={translationFileHref(teamId, studyId, lang, format)}
            aria-label={`Export ${format.toUpperCase()} for ${name}`}
            download
          >
            Export {format.toUpperCase()}
          </a>
        ))}
        {canImport && (
          <FilePickButton
            className="inline-flex h-8 cursor-pointer items-center rounded-md bg-primary px-3 text-sm font-medium text-white hover:bg-primary-strong has-[:disabled]:cursor-not-allowed has-[:disabled]:opacity-50"
            accept=".xlf,.xliff,.xml,.csv,application/xliff+xml,text/csv"
            disabled={importer.isPending}
            inputLabel={`Import a file into ${name}`}
            onFile={(file) => void onFile(file)}
          >
            {importer.isPending ? 'Importing…' : 'Import a file'}
          </FilePickButton>
        )}
      </div>
      {(report || refusal) && (
        <div className="mt-4" aria-live="polite">
          {report && <ImportReport report={report} lang={lang} />}
          {refusal && <ImportRefusal error={refusal} />}
        </div>
      )}
    </Card>
  );
}
