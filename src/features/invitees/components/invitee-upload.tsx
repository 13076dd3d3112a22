/**
 * Upload an invitee list: choose a CSV, see the preview, then import. With problems in the
 * file nothing is imported unless the user explicitly imports only the valid rows.
 */
import { useId, useRef, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/feedback';
import { ErrorText } from '@/components/ui/error-boundary';
import { usePreviewInvitees } from '../api/preview-invitees';
import { useImportInvitees } from '../api/import-invitees';
import { CsvPreview } from './csv-preview';

export function InviteeUpload({
  teamId,
  studyId,
  notInvited,
  onImported,
}: {
  teamId: string;
  studyId: string;
  /** People on the list not invited yet, from the live counts (so this stays true after a send). */
  notInvited: number;
  onImported?: () => void;
}) {
  const inputId = useId();
  const inputRef = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const preview = usePreviewInvitees(teamId, studyId);
  const importing = useImportInvitees(teamId, studyId);

  const choose = (f: File | null) => {
    setFile(f);
    importing.reset();
    if (f) preview.mutate(f);
    else preview.reset();
  };
  const startOver = () => {
    if (inputRef.current) inputRef.current.value = '';
    choose(null);
  };
  const runImport = (onlyValid: boolean) => {
    if (!file) return;
    importing.mutate(
      { file, onlyValid },
      {
        onSuccess: () => {
          if (inputRef.current) inputRef.current.value = '';
          setFile(null);
          preview.reset();
          onImported?.();
        },
      },
    );
  };
  const p = preview.data;

  return (
    <div className="space-y-4">
      <div>
        <label htmlFor={inputId} className="block text-sm font-medium text-ink">
          Invitee list (CSV)
        </label>
        <p className="mb-2 text-xs text-ink-muted">
          First row names the columns: <code className="font-mono">email</code> (required),{' '}
          <code className="font-mono">name</code> and <code className="font-mono">external_id</code>{' '}
          (optional). Comma, semicolon or tab separated; up to 50,000 rows, 5 MB.
        </p>
        <input
          ref={inputRef}
          id={inputId}
          type="file"
          accept=".csv,.txt,text/csv,text/plain"
          className="block w-full text-sm text-ink-soft file:mr-3 file:h-9 file:rounded-md file:border file:border-line file:bg-white file:px-3 file:text-sm file:font-medium file:text-ink hover:file:border-primary"
          onChange={(e) => choose(e.target.files?.[0] ?? null)}
        />
      </div>
      {preview.isPending && <p className="text-sm text-ink-muted">Reading the file…</p>}
      <ErrorText error={preview.error} />
      {p && <CsvPreview preview={p} />}
      {p && p.validCount > 0 && (
        <div className="flex flex-wrap gap-2">
          {p.errorCount === 0 ? (
            <Button busy={importing.isPending} onClick={() => runImport(false)}>
              Import {p.validCount} invitee{p.validCount === 1 ? '' : 's'}
            </Button>
          ) : (
            <Button variant="secondary" busy={importing.isPending} onClick={() => runImport(true)}>
              Import only the {p.validCount} valid row{p.validCount === 1 ? '' : 's'}
            </Button>
          )}
          <Button variant="ghost" onClick={startOver}>
            Choose another file
          </Button>
        </div>
      )}
      <ErrorText error={importing.error} />
      {importing.data && (
        <Alert tone="success">
          Imported {importing.data.imported} invitee{importing.data.imported === 1 ? '' : 's'}
          {importing.data.skipped > 0 && `; ${importing.data.skipped} row(s) left out`}.{' '}
          {notInvited === 0
            ? 'Everybody on the list has been invited.'
            : `${notInvited} on the list not invited yet.`}
        </Alert>
      )}
    </div>
  );
}
