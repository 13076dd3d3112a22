import type { ImportPreview } from '@shared/schemas/study-import';
import { Alert } from '@/components/ui/feedback';
import { ProblemTable } from '@/components/ui/problem-table';
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
          <ProblemTable
            label="Problems in the files"
            columns={[
              { header: 'File' },
              { header: 'Line', numeric: true },
              { header: 'Column' },
              { header: 'Problem' },
            ]}
            rows={preview.problems.map((p, i) => ({
              key: String(i),
              cells: [
                fileLabels[p.file],
                p.line ?? '—',
                <span className="font-mono text-xs">{p.column ?? '—'}</span>,
                p.message,
              ],
            }))}
          />
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
