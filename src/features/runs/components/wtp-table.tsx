/**
 * Population willingness to pay, −β_k / β_cost over the population: the MEAN and the MEDIAN
 * WTP (they differ when tastes or the cost are random), each with delta-method and
 * Krinsky–Robb 95 % intervals from the covariance the run chose; or why WTP is withheld.
 */
import type { RunResult } from '@shared/schemas/run';
import { Alert } from '@/components/ui/feedback';
import { formatNumber } from '../utils/format';

type Interval = {
  estimate: number;
  se: number | null;
  deltaLower: number | null;
  deltaUpper: number | null;
  lower: number | null;
  upper: number | null;
};

function Cells({ w }: { w: Interval | null | undefined }) {
  if (!w)
    return (
      <>
        <td className="num px-2 py-1.5">—</td>
        <td className="num px-2 py-1.5">—</td>
        <td className="num px-2 py-1.5">—</td>
      </>
    );
  return (
    <>
      <td className="num px-2 py-1.5">
        {formatNumber(w.estimate, 2)}
        <span className="block text-xs text-ink-muted">SE {formatNumber(w.se, 2)}</span>
      </td>
      <td className="num px-2 py-1.5">
        {formatNumber(w.deltaLower, 2)} to {formatNumber(w.deltaUpper, 2)}
      </td>
      <td className="num px-2 py-1.5">
        {formatNumber(w.lower, 2)} to {formatNumber(w.upper, 2)}
      </td>
    </>
  );
}

export function WtpTable({ results }: { results: RunResult }) {
  if (results.wtpWithheld)
    return (
      <Alert tone="warning" title="WTP withheld">
        {results.wtpWithheld}
      </Alert>
    );
  if (!results.wtp || results.wtp.length === 0)
    return <p className="text-sm text-ink-soft">This run has no cost coefficient, so no WTP.</p>;
  const label = new Map(results.columns.map((c) => [c.coefficient, c.label]));
  // With fixed coefficients the median equals the mean: one set of columns is enough.
  const hasMedian = results.wtp.some(
    (w) => w.median && Math.abs(w.median.estimate - w.estimate) > 1e-9 * Math.abs(w.estimate),
  );
  const used = results.covariance?.used ?? 'classical';
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm">
        <caption className="sr-only">Willingness to pay</caption>
        <thead>
          <tr className="border-b border-line text-xs text-ink-soft">
            <th scope="col" className="px-2 py-2 text-left font-medium">
              Attribute column
            </th>
            {[
              'Mean WTP',
              'Delta 95 %',
              // HB: the interval of the population mean WTP over the posterior draws.
              results.model === 'hb' ? 'Posterior 95 %' : 'Krinsky–Robb 95 %',
              ...(hasMedian ? ['Median WTP', 'Delta 95 %', 'Krinsky–Robb 95 %'] : []),
            ].map((h, i) => (
              <th key={`${h}-${i}`} scope="col" className="px-2 py-2 text-right font-medium">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {results.wtp.map((w) => (
            <tr key={w.name} className="border-b border-line/60 last:border-b-0">
              <th scope="row" className="px-2 py-1.5 text-left font-normal text-ink">
                {label.get(w.name) ?? w.name}
              </th>
              <Cells w={w} />
              {hasMedian && <Cells w={w.median} />}
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-2 text-xs text-ink-muted">
        In the cost attribute&apos;s unit per unit of each column
        {results.space === 'wtp' ? ', estimated directly in WTP space' : ''}. Mean and median are
        over the population of respondents
        {hasMedian ? '' : ' (equal here: no random taste or cost)'}; intervals from the {used}{' '}
        covariance.
      </p>
    </div>
  );
}
