/**
 * Population willingness to pay, −β_k / β_cost over the population: the MEAN and the MEDIAN
 * WTP (they differ when tastes or the cost are random), each with delta-method and
 * Krinsky–Robb 95 % intervals from the covariance the run chose; or why WTP is withheld.
 * Every row says its unit and basis (what money, for what change); amounts go through Intl.
 */
import type { RunResult } from '@shared/schemas/run';
import { Alert } from '@/components/ui/feedback';
import { formatAmount, formatInterval } from '@/utils/format';
import { getLabelOf, getWtpHeadings } from '@shared/results/parameter-labels';
import { EstimateTable, estimateRowClass } from './estimate-table';

type Interval = {
  estimate: number;
  se: number | null;
  deltaLower: number | null;
  deltaUpper: number | null;
  lower: number | null;
  upper: number | null;
};

function Cells({ w, unit }: { w: Interval | null | undefined; unit: string | null }) {
  if (!w)
    return (
      <>
        <td className="num px-2 py-1.5">—</td>
        <td className="num px-2 py-1.5">—</td>
        <td className="num px-2 py-1.5">—</td>
      </>
    );
  const money = (x: number | null | undefined) => formatAmount(x, unit);
  return (
    <>
      <td className="num px-2 py-1.5 whitespace-nowrap">
        {money(w.estimate)}
        <span className="block text-xs text-ink-muted">SE {money(w.se)}</span>
      </td>
      <td className="num px-2 py-1.5 whitespace-nowrap">
        {formatInterval(w.deltaLower, w.deltaUpper, money)}
      </td>
      <td className="num px-2 py-1.5 whitespace-nowrap">
        {formatInterval(w.lower, w.upper, money)}
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
  const labelOf = getLabelOf(results);
  const unitOf = new Map(results.columns.map((c) => [c.coefficient, c.wtpUnit ?? null]));
  const headings = getWtpHeadings(results);
  const unit = results.costUnit ?? null;
  const used = results.covariance?.used ?? 'classical';
  return (
    <EstimateTable
      caption="Willingness to pay"
      rowHeading="Attribute column · unit and basis"
      headings={[
        headings.mean,
        'Delta 95 %',
        // HB: the interval of the population mean WTP over the posterior draws.
        results.model === 'hb' ? 'Posterior 95 %' : 'Krinsky–Robb 95 %',
        ...(headings.median ? [headings.median, 'Delta 95 %', 'Krinsky–Robb 95 %'] : []),
      ]}
      note={
        <>
          WTP = −β/β<sub>cost</sub>
          {results.space === 'wtp' ? ', estimated directly in WTP space' : ''}: money per change of
          each column, as its line says; a negative amount is money needed to accept the change.{' '}
          {headings.median
            ? 'Population mean and median are over the estimated distribution of tastes; they differ from the WTP at population means when the cost coefficient is random.'
            : headings.mean === 'Population mean WTP'
              ? 'With a fixed cost coefficient the population mean WTP equals the WTP at population means.'
              : ''}{' '}
          Each respondent&apos;s conditional-mean WTP is in Tastes. Intervals from the {used}{' '}
          covariance.
        </>
      }
    >
      {results.wtp.map((w) => (
        <tr key={w.name} className={estimateRowClass}>
          <th scope="row" className="min-w-48 px-2 py-1.5 text-left font-normal text-ink">
            {labelOf(w.name)}
            {unitOf.get(w.name) && (
              <span className="block text-xs text-ink-muted">{unitOf.get(w.name)}</span>
            )}
          </th>
          <Cells w={w} unit={unit} />
          {headings.median && <Cells w={w.median} unit={unit} />}
        </tr>
      ))}
    </EstimateTable>
  );
}
