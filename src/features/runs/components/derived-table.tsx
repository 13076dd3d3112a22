/**
 * Quantities derived from the parameters (lognormal mean, median and SD; SDs, correlations and
 * wrong-sign shares of random tastes) with delta-method and simulated (Krinsky–Robb) 95 %
 * intervals from the covariance the run chose.
 */
import type { RunResult } from '@shared/schemas/run';
import { formatInterval, formatNumber } from '@/utils/format';
import { describeDerived, getLabelOf } from '@shared/results/parameter-labels';
import { EstimateTable, estimateRowClass } from './estimate-table';

/** Covariances and correlations are shown as matrices (implied-covariance.tsx). */
const inMatrix = (q: string) => q === 'covariance' || q === 'correlation';

export function DerivedTable({ results }: { results: RunResult }) {
  const derived = (results.derived ?? []).filter((d) => !inMatrix(d.quantity));
  if (derived.length === 0) return null;
  const labelOf = getLabelOf(results);
  const used = results.covariance?.used === 'classical' ? 'classical' : 'robust';
  return (
    <EstimateTable
      caption="Derived quantities"
      rowHeading="Quantity"
      headings={['Estimate', 'SE (delta)', 'Delta 95 %', 'SE (simulated)', 'Simulated 95 %']}
      note={
        <>
          From the {used} covariance of the estimates: delta method, and 2000 draws of the
          parameters from their estimated sampling distribution (Krinsky–Robb).
        </>
      }
    >
      {derived.map((d) => (
        <tr key={`${d.name}-${d.quantity}`} className={estimateRowClass}>
          <th scope="row" className="px-2 py-1.5 text-left font-normal text-ink">
            {describeDerived(d, labelOf)}
          </th>
          <td className="num px-2 py-1.5">{formatNumber(d.estimate)}</td>
          <td className="num px-2 py-1.5">{formatNumber(d.se)}</td>
          <td className="num px-2 py-1.5">{formatInterval(d.deltaLower, d.deltaUpper)}</td>
          <td className="num px-2 py-1.5">{formatNumber(d.simulatedSe)}</td>
          <td className="num px-2 py-1.5">{formatInterval(d.lower, d.upper)}</td>
        </tr>
      ))}
    </EstimateTable>
  );
}
