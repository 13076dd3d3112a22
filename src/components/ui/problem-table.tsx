import type { ReactNode } from 'react';
import { cn } from '@/lib/cn';

type Column = { header: string; numeric?: boolean };

/** The problems of an uploaded file, one row each, in a scrolling table marked as errors. */
export function ProblemTable({
  label,
  columns,
  rows,
}: {
  label: string;
  columns: Column[];
  rows: { key: string; cells: ReactNode[] }[];
}) {
  return (
    <div className="max-h-72 overflow-auto rounded-md border border-danger/30">
      <table className="w-full text-sm" aria-label={label}>
        <thead className="sticky top-0 bg-danger-soft text-xs text-ink-soft">
          <tr>
            {columns.map((c) => (
              <th
                key={c.header}
                scope="col"
                className={cn('px-2 py-1.5 font-medium', c.numeric ? 'text-right' : 'text-left')}
              >
                {c.header}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => (
            <tr key={row.key} className="border-t border-line/60 align-top">
              {row.cells.map((cell, i) => (
                <td key={i} className={cn('px-2 py-1', columns[i].numeric && 'num text-right')}>
                  {cell}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/** A problem of an uploaded CSV, at a data row and (where known) a column. */
export type RowProblem = { row: ReactNode; column?: string | null; message: string };

/** The problems of an uploaded CSV by row and column; a problem of a whole row shows a dash. */
export function RowProblemTable({ label, problems }: { label: string; problems: RowProblem[] }) {
  return (
    <ProblemTable
      label={label}
      columns={[{ header: 'Row', numeric: true }, { header: 'Column' }, { header: 'Problem' }]}
      rows={problems.map((p, i) => ({
        key: String(i),
        cells: [p.row, p.column || '—', p.message],
      }))}
    />
  );
}
