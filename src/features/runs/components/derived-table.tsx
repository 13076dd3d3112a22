/**
 * Quantities derived from the parameters (lognormal mean, median and SD; SDs, correlations and
 * wrong-sign shares of random tastes) with delta-method and simulated (Krinsky–Robb) 95 %
 * intervals from the covariance the run chose.
 */
import type { RunResult } from '@shared/schemas/run';
import { formatInterval, formatNumber } from '@/utils/format';
import { describeDerived, getLabelOf } from '@shared/results/parameter-labels';

/** Covariances and correlations are shown as matrices (implied-covariance.tsx). */
const inMatrix = (q: string) => q === 'covariance' || q === 'correlation';

export function DerivedTable({ results }: { results: RunResult }) {
  const derived = (results.derived ?? []).filter((d) => !inMatrix(d.quantity));
  if (derived.length === 0) return null;
  const labelOf = getLabelOf(results);
  const used = results.covariance?.used === 'classical' ? 'classical' : 'robust';
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm">
        <caption className="sr-only">Derived quantities</caption>
        <thead>
          <tr className="border-b border-line text-xs text-ink-soft">
            <th scope="col" className="px-2 py-2 text-left font-medium">
              Quantity
            </th>
            {['Estimate', 'SE (delta)', 'Delta 95 %', 'SE (simulated)', 'Simulated 95 %'].map(
              (h) => (
                <th key={h} scope="col" className="px-2 py-2 text-right font-medium">
                  {h}
                </th>
              ),
            )}
          </tr>
        </thead>
        <tbody>
          {derived.map((d) => (
            <tr key={`${d.name}-${d.quantity}`} className="border-b border-line/60 last:border-b-0">
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
        </tbody>
      </table>
      <p className="mt-2 text-xs text-ink-muted">
        From the {used} covariance of the estimates: delta method, and 2000 draws of the parameters
        from their estimated sampling distribution (Krinsky–Robb).
      </p>
    </div>
  );
}
