/**
 * Compare two runs' individual estimates (for instance HB posterior means beside the mixed
 * logit's conditional means): a second run, a coefficient, the scatter of respondents and the
 * correlation of every shared coefficient.
 */
import { useState } from 'react';
import type { TastesRun } from '@shared/schemas/tastes';
import { MODEL_LABELS } from '@shared/schemas/estimation-families';
import { SelectField } from '@/components/ui/field';
import { ErrorText } from '@/components/ui/error-boundary';
import { Spinner } from '@/components/ui/feedback';
import { formatNumber } from '@/utils/format';
import { useTasteComparison } from '../api/compare-tastes';
import { ComparisonScatter } from './comparison-scatter';
import { RunPicker } from './run-picker';
import { MEAN_NAMES } from '../utils/mean-names';
import { Options } from '@/components/ui/options';

/** The run to compare with by default: another family first (HB ↔ mixed logit), else any other. */
export function pickComparisonRun(runs: TastesRun[], run: TastesRun | undefined): string {
  const others = runs.filter((r) => r.profiles > 0 && r.id !== run?.id);
  const partner = run?.model === 'mixed' ? 'hb' : 'mixed';
  return (others.find((r) => r.model === partner) ?? others[0])?.id ?? '';
}

export function ComparisonPanel({
  teamId,
  studyId,
  runs,
  runId,
}: {
  teamId: string;
  studyId: string;
  runs: TastesRun[];
  runId: string;
}) {
  const run = runs.find((r) => r.id === runId);
  const [chosen, setChosen] = useState('');
  const otherRunId = chosen && chosen !== runId ? chosen : pickComparisonRun(runs, run);
  const comparison = useTasteComparison(teamId, studyId, runId, otherRunId);
  const [coefficient, setCoefficient] = useState('');
  const others = runs.filter((r) => r.profiles > 0 && r.id !== runId);
  if (!run || others.length === 0) return null;
  const data = comparison.data;
  const current = data?.coefficients.find((c) => c.name === coefficient) ?? data?.coefficients[0];
  const other = runs.find((r) => r.id === otherRunId);
  const axis = (r: TastesRun | undefined) =>
    r ? `${r.name} (${MEAN_NAMES[r.model] ?? 'mean'})` : '';
  return (
    <section aria-labelledby="comparison-heading" className="space-y-3">
      <div>
        <h3 id="comparison-heading" className="text-base font-semibold text-ink">
          Compare with another run
        </h3>
        <p className="text-xs text-ink-muted">
          Each respondent&apos;s individual mean under this run ({MODEL_LABELS[run.model]}) against
          another. A high correlation says both models rank respondents alike; points off the dashed
          line show where they disagree.
        </p>
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <RunPicker runs={others} value={otherRunId} onChange={setChosen} label="Compare with" />
        {data && data.coefficients.length > 0 && (
          <SelectField
            label="Coefficient"
            value={current?.name ?? ''}
            onChange={(e) => setCoefficient(e.target.value)}
          >
            <Options items={data.coefficients.map((c) => ({ value: c.name, label: c.label }))} />
          </SelectField>
        )}
      </div>
      <ErrorText error={comparison.error} />
      {!data && comparison.isPending && <Spinner label="Matching respondents…" />}
      {data && data.coefficients.length === 0 && (
        <p className="text-sm text-ink-soft">The two runs share no coefficient.</p>
      )}
      {data && current && (
        <div className="grid gap-4 lg:grid-cols-[3fr_2fr]">
          <ComparisonScatter
            label={current.label}
            xTitle={axis(run)}
            yTitle={axis(other)}
            pairs={current.pairs}
          />
          <div className="overflow-x-auto">
            <table className="w-full min-w-[18rem] text-sm">
              <caption className="mb-1 text-left text-xs text-ink-muted">
                {data.respondents} respondents in both runs
              </caption>
              <thead>
                <tr className="border-b border-line text-left text-xs text-ink-muted">
                  <th className="px-2 py-1.5 font-medium">Coefficient</th>
                  <th className="num px-2 py-1.5 font-medium">Correlation</th>
                  <th className="num px-2 py-1.5 font-medium">Mean difference</th>
                </tr>
              </thead>
              <tbody>
                {data.coefficients.map((c) => (
                  <tr
                    key={c.name}
                    className={`border-b border-line/60 ${c.name === current.name ? 'bg-primary-soft/60' : ''}`}
                  >
                    <th scope="row" className="px-2 py-1.5 text-left font-normal">
                      {c.label}
                    </th>
                    <td className="num px-2 py-1.5">{formatNumber(c.correlation, 3)}</td>
                    <td className="num px-2 py-1.5">{formatNumber(c.meanDifference, 3)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
            <p className="mt-1 text-xs text-ink-muted">
              Mean difference: second run minus this one. Fixed coefficients have no spread, so
              their correlation is not defined (—).
            </p>
          </div>
        </div>
      )}
    </section>
  );
}
