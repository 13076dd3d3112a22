import type { InviteeCsvPreview } from '@shared/schemas/invitees';
import { Alert } from '@/components/ui/feedback';
import { RowProblemTable } from '@/components/ui/problem-table';
import { DataTable } from '@/components/ui/data-table';

const fieldLabels: Record<string, string> = {
  email: 'e-mail',
  name: 'name',
  externalId: 'external id',
};

/** What an import would do: the column mapping, a sample of rows and every row-level problem. */
export function CsvPreview({ preview }: { preview: InviteeCsvPreview }) {
  const ignored = preview.columns.filter((c) => c.field === null);
  return (
    <div className="space-y-4">
      <p className="text-sm text-ink">
        <span className="num font-medium">{preview.totalRows}</span> rows read:{' '}
        <span className="num font-medium text-success">{preview.validCount}</span> ready to import,{' '}
        <span
          className={preview.errorCount > 0 ? 'num font-medium text-danger' : 'num font-medium'}
        >
          {preview.errorCount}
        </span>{' '}
        with problems.
      </p>
      {preview.columns.length > 0 && (
        <p className="text-xs text-ink-soft">
          Columns:{' '}
          {preview.columns
            .filter((c) => c.field)
            .map((c) => `“${c.header}” → ${fieldLabels[c.field!]}`)
            .join(', ')}
          {ignored.length > 0 && `; ignored: ${ignored.map((c) => `“${c.header}”`).join(', ')}`}
        </p>
      )}
      {preview.errors.length > 0 && (
        <div>
          <h4 className="mb-1 text-sm font-semibold text-danger">Problems</h4>
          <RowProblemTable label="Problems in the list" problems={preview.errors} />
          {preview.errorCount > preview.errors.length && (
            <p className="mt-1 text-xs text-ink-muted">Only the first problems are listed.</p>
          )}
        </div>
      )}
      {preview.sample.length > 0 && (
        <div>
          <h4 className="mb-1 text-sm font-semibold text-ink">First valid rows</h4>
          <DataTable
            look="framed"
            className="w-full min-w-[28rem] text-sm"
            label="First valid rows"
            headCellClassName="px-2 py-1.5 font-medium"
            headings={[{ label: 'Row', align: 'right' }, 'E-mail', 'Name', 'External id']}
          >
            {preview.sample.slice(0, 5).map((r) => (
              <tr key={r.row} className="border-t border-line/60">
                <td className="num px-2 py-1">{r.row}</td>
                <td className="px-2 py-1">{r.email}</td>
                <td className="px-2 py-1">{r.name || '—'}</td>
                <td className="px-2 py-1 font-mono text-xs">{r.externalId ?? '—'}</td>
              </tr>
            ))}
          </DataTable>
        </div>
      )}
      {preview.validCount === 0 && preview.errors.length === 0 && (
        <Alert tone="warning">The file has no invitees.</Alert>
      )}
    </div>
  );
}
