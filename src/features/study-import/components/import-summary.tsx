import type { ImportPreview } from '@shared/schemas/study-import';
import { Alert } from '@/components/ui/feedback';
import { formatCount } from '@/utils/format';

const fileLabels = { choices: 'Choice file', background: 'Background file' } as const;

/** What the files hold and every problem found, with its file, line and column. */
export function ImportSummary({ preview }: { preview: ImportPreview }) {
  const count = (n: number) => <span className="num font-medium">{formatCount(n)}</span>;
  return (
    <div className="space-y-3">
      <p className="text-sm text-ink">
        {count(preview.rows)} rows: {count(preview.respondents)} respondents, {count(preview.tasks)}{' '}
        tasks of {count(preview.alternativesPerTask)} alternatives, {count(preview.choiceSets)}{' '}
        different choice sets
        {preview.background &&
          `; background answers for ${formatCount(preview.background.respondents)} respondents`}
        .
      </p>
      {preview.problemCount === 0 ? (
        <Alert tone="success">No problems found: the study can be created.</Alert>
      ) : (
        <div>
          <h3 className="mb-1 text-sm font-semibold text-danger">
            {formatCount(preview.problemCount)} problem{preview.problemCount === 1 ? '' : 's'} —
            nothing can be saved until the file is fixed
          </h3>
          <div className="max-h-72 overflow-auto rounded-md border border-danger/30">
            <table className="w-full text-sm" aria-label="Problems in the files">
              <thead className="sticky top-0 bg-danger-soft text-xs text-ink-soft">
                <tr>
                  <th scope="col" className="px-2 py-1.5 text-left font-medium">
                    File
                  </th>
                  <th scope="col" className="px-2 py-1.5 text-right font-medium">
                    Line
                  </th>
                  <th scope="col" className="px-2 py-1.5 text-left font-medium">
                    Column
                  </th>
                  <th scope="col" className="px-2 py-1.5 text-left font-medium">
                    Problem
                  </th>
                </tr>
              </thead>
              <tbody>
                {preview.problems.map((p, i) => (
                  <tr key={i} className="border-t border-line/60 align-top">
                    <td className="px-2 py-1 whitespace-nowrap">{fileLabels[p.file]}</td>
                    <td className="num px-2 py-1 text-right">{p.line ?? '—'}</td>
                    <td className="px-2 py-1 font-mono text-xs">{p.column ?? '—'}</td>
                    <td className="px-2 py-1">{p.message}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          {preview.problemCount > preview.problems.length && (
            <p className="mt-1 text-xs text-ink-muted">
              The first {preview.problems.length} problems are listed.
            </p>
          )}
        </div>
      )}
    </div>
  );
}
