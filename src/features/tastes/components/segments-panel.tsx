/**
 * Segments: the analyst picks a coefficient and a grouping (the alternative chosen in a task,
 * the answer to a single-choice or number question, or for a latent class run the likeliest
 * class) and sees the groups' distributions of individual means with their counts and means.
 */
import { useState } from 'react';
import { Card, Spinner } from '@/components/ui/feedback';
import { ErrorText } from '@/components/ui/error-boundary';
import { SelectField } from '@/components/ui/field';
import type { TasteHeader } from '@shared/schemas/tastes';
import { useSegments } from '../api/get-segments';
import { formatNumber } from '@/utils/format';
import { SegmentsChart, type SegmentsView } from './segments-chart';
import { MEAN_NAMES } from '../utils/mean-names';
import { DataTable, figureHeading } from '@/components/ui/data-table';
import { Options } from '@/components/ui/options';

type GroupBy = 'task' | 'question' | 'class';

const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

export function SegmentsPanel({
  teamId,
  studyId,
  header,
}: {
  teamId: string;
  studyId: string;
  header: TasteHeader;
}) {
  // Single-choice questions first: their few named groups read better than numbers.
  const groupable = [
    ...header.questions.filter((q) => q.type === 'single'),
    ...header.questions.filter((q) => q.type === 'number'),
  ];
  const random = header.coefficients.filter((c) => c.distribution !== 'fixed');
  const [coefficient, setCoefficient] = useState((random[0] ?? header.coefficients[0])?.name ?? '');
  const classes = header.run.model === 'latent_class';
  const [groupBy, setGroupBy] = useState<GroupBy>(
    classes ? 'class' : groupable.length ? 'question' : 'task',
  );
  const [question, setQuestion] = useState(groupable[0]?.key ?? '');
  const [task, setTask] = useState(header.tasks[0]?.task ?? 1);
  const [view, setView] = useState<SegmentsView>('histogram');
  const segments = useSegments(teamId, studyId, {
    runId: header.run.id,
    coefficient,
    groupBy,
    ...(groupBy === 'task' ? { task } : groupBy === 'question' ? { question } : {}),
  });

  return (
    <Card title="Segments">
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <SelectField
          label="Coefficient"
          value={coefficient}
          onChange={(e) => setCoefficient(e.target.value)}
        >
          <Options items={header.coefficients.map((c) => ({ value: c.name, label: c.label }))} />
        </SelectField>
        <SelectField
          label="Split by"
          value={groupBy}
          onChange={(e) => setGroupBy(e.target.value as GroupBy)}
        >
          {classes && <option value="class">Likeliest latent class</option>}
          <option value="question" disabled={groupable.length === 0}>
            Answer to a background question
          </option>
          <option value="task">Alternative chosen in a task</option>
        </SelectField>
        {groupBy === 'class' ? null : groupBy === 'question' ? (
          <SelectField
            label="Question"
            value={question}
            onChange={(e) => setQuestion(e.target.value)}
          >
            <Options items={groupable.map((q) => ({ value: q.key, label: q.text }))} />
          </SelectField>
        ) : (
          <SelectField label="Task" value={task} onChange={(e) => setTask(Number(e.target.value))}>
            {header.tasks.map((t) => (
              <option key={t.task} value={t.task}>
                Task {t.task} (block {t.block})
              </option>
            ))}
          </SelectField>
        )}
        <SelectField
          label="Chart"
          value={view}
          onChange={(e) => setView(e.target.value as SegmentsView)}
        >
          <option value="histogram">Overlaid histograms</option>
          <option value="box">Box plots</option>
        </SelectField>
      </div>
      {groupBy === 'task' && (
        <p className="mt-3 rounded-md border border-accent/50 bg-accent-soft px-3 py-2 text-xs text-ink">
          Read this split with care: the profiles were computed from these same choices, so
          respondents who chose an alternative get profiles that favour it, and part of the
          difference between the groups arises by construction. A split by a background question
          does not share this problem.
        </p>
      )}
      <div className="mt-4">
        {segments.isPending && segments.fetchStatus !== 'idle' && <Spinner label="Splitting…" />}
        <ErrorText error={segments.error} />
        {segments.data && (
          <>
            <SegmentsChart data={segments.data} view={view} />
            <p className="mt-4 mb-1 text-xs text-ink-muted">
              {capitalise(MEAN_NAMES[header.run.model])}s of {segments.data.coefficient.label} by{' '}
              {segments.data.groupLabel}
              {segments.data.ungrouped > 0 &&
                ` (${segments.data.ungrouped} respondents without an answer left out)`}
            </p>
            <DataTable
              className="min-w-full text-sm"
              bodyClassName="font-mono tabular-nums"
              headings={[
                'Group',
                ...['Count', 'Mean', 'SD', 'Median', 'Quartiles'].map((h) => figureHeading(h)),
              ]}
            >
              {segments.data.groups.map((g) => (
                <tr key={g.key} className="border-b border-line/60">
                  <td className="px-2 py-1 font-sans whitespace-nowrap">{g.label}</td>
                  <td className="px-2 py-1 text-right">{g.count}</td>
                  <td className="px-2 py-1 text-right">{formatNumber(g.mean)}</td>
                  <td className="px-2 py-1 text-right">{formatNumber(g.sd)}</td>
                  <td className="px-2 py-1 text-right">{formatNumber(g.median)}</td>
                  <td className="px-2 py-1 text-right whitespace-nowrap">
                    {formatNumber(g.q1)} … {formatNumber(g.q3)}
                  </td>
                </tr>
              ))}
            </DataTable>
          </>
        )}
      </div>
    </Card>
  );
}
