/**
 * What a translator's file import did (texts taken, the texts still missing and the file's
 * texts the study does not have, each named by where respondents meet it), or why the whole
 * file was refused (each problem with its line or field).
 */
import type { ReactNode } from 'react';
import { Alert } from '@/components/ui/feedback';
import { ApiError } from '@/lib/api-client';
import { languageName } from '@shared/languages/language-tags';
import type { TranslationImportReport } from '@shared/schemas/study-texts';

const plural = (n: number, one: string, many = `${one}s`) =>
  `${n.toLocaleString('en')} ${n === 1 ? one : many}`;

function KeyList({ label, children }: { label: string; children: ReactNode }) {
  return (
    <ul
      aria-label={label}
      className="mt-2 max-h-72 divide-y divide-line overflow-auto rounded-md border border-line bg-white"
    >
      {children}
    </ul>
  );
}

function KeyItem({ where, textKey, line }: { where: string; textKey: string; line?: number }) {
  return (
    <li className="min-w-0 px-3 py-2 text-sm">
      <p className="break-words text-ink">{where || 'No note in the file'}</p>
      <p className="break-words font-mono text-[11px] text-ink-muted">
        {textKey}
        {line ? ` · line ${line}` : ''}
      </p>
    </li>
  );
}

export function ImportReport({ report, lang }: { report: TranslationImportReport; lang: string }) {
  const name = languageName(lang);
  const { imported, missing, extra } = report;
  return (
    <section aria-label="Import report" className="space-y-4">
      <Alert tone={imported > 0 ? 'success' : 'warning'}>
        {imported > 0
          ? `Imported ${plural(imported, 'text')} into ${name}.`
          : `No text was imported: the file’s ${name} wordings are all empty.`}
      </Alert>
      {missing.length > 0 ? (
        <div>
          <h3 className="text-sm font-semibold text-ink">
            Still missing in {name}: {plural(missing.length, 'text')}
          </h3>
          <p className="text-sm text-ink-soft">
            The file lacks these or leaves them empty. Write them in the table below, or in the file
            and import it again; the study cannot go live without them.
          </p>
          <KeyList label={`Texts still missing in ${name}`}>
            {missing.map((m) => (
              <KeyItem key={m.key} where={m.where} textKey={m.key} />
            ))}
          </KeyList>
        </div>
      ) : (
        <p className="text-sm text-ink-soft">
          Every text of the study now has a wording in {name}.
        </p>
      )}
      {extra.length > 0 && (
        <div>
          <h3 className="text-sm font-semibold text-ink">
            Left out: {plural(extra.length, 'text')} this study does not have
          </h3>
          <p className="text-sm text-ink-soft">
            Usually a page, option or level removed since the file was exported. Nothing was saved
            for them.
          </p>
          <KeyList label="Texts of the file this study does not have">
            {extra.map((x) => (
              <KeyItem key={`${x.key}-${x.line}`} where={x.where} textKey={x.key} line={x.line} />
            ))}
          </KeyList>
        </div>
      )}
    </section>
  );
}

/** A refused file: the reason, each problem (with its line where the file has one). */
export function ImportRefusal({ error }: { error: Error }) {
  const fields = error instanceof ApiError ? error.fields : [];
  return (
    <Alert tone="danger" title={error.message}>
      <p>Nothing was changed.</p>
      {fields.length > 0 && (
        <ul aria-label="Problems in the file" className="mt-2 list-disc space-y-1 ps-5">
          {fields.map((f, i) => (
            <li key={i} className="break-words">
              {f.message}
            </li>
          ))}
        </ul>
      )}
    </Alert>
  );
}
