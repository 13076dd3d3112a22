import { useState } from 'react';
import { ApiError } from '@/lib/api-client';
import { Alert } from '@/components/ui/feedback';
import { FilePickButton } from '@/components/ui/file-pick-button';
import { RowProblemTable } from '@/components/ui/problem-table';

type RowError = { row: string; column: string; message: string };

/** Server field paths `rows.<row>.<column>` as table rows. */
function toRowErrors(err: ApiError): RowError[] {
  return err.fields.map((f) => {
    const m = f.path.match(/^rows\.(\d+)(?:\.(.*))?$/);
    return { row: m?.[1] ?? '', column: m?.[2] ?? '', message: f.message };
  });
}

/** Upload a design CSV; on errors nothing is saved and each problem is listed by row. */
export function CsvImport({
  disabled,
  busy,
  onImport,
}: {
  disabled: boolean;
  busy: boolean;
  onImport: (file: File) => Promise<unknown>;
}) {
  const [error, setError] = useState<ApiError | Error | null>(null);
  const [done, setDone] = useState(false);
  const onFile = async (file: File | undefined) => {
    if (!file) return;
    setError(null);
    setDone(false);
    try {
      await onImport(file);
      setDone(true);
    } catch (err) {
      setError(err as Error);
    }
  };
  const rows = error instanceof ApiError && error.code === 'invalid_csv' ? toRowErrors(error) : [];
  return (
    <div className="space-y-3">
      <p className="text-sm text-ink-soft">
        One row per alternative: <code className="font-mono text-xs">block, task, alternative</code>
        , then one column per attribute named as in Attributes, holding the level label (or the
        value of a numeric attribute). Export a design to see the layout.
      </p>
      <FilePickButton
        className="inline-flex min-h-10 cursor-pointer items-center rounded-md border border-line bg-white px-4 text-sm font-medium text-ink hover:border-primary hover:text-primary has-[:disabled]:cursor-not-allowed has-[:disabled]:opacity-50"
        accept=".csv,text/csv"
        disabled={disabled || busy}
        onFile={(file) => void onFile(file)}
      >
        {busy ? 'Importing…' : 'Import design from CSV'}
      </FilePickButton>
      {done && <Alert tone="success">Design imported.</Alert>}
      {error && (
        <Alert tone="danger" title={error.message}>
          {rows.length > 0 && (
            <div className="mt-2">
              <RowProblemTable label="Problems in the design file" problems={rows} />
            </div>
          )}
        </Alert>
      )}
    </div>
  );
}
