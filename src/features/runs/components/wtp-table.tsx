/**
 * Population willingness to pay −β_k / β_cost with delta-method and Krinsky–Robb 95 %
 * intervals, in the cost attribute's unit per unit of each attribute column.
 */
import type { RunResult } from '@shared/schemas/run';
import { formatNumber } from '../utils/format';

export function WtpTable({ results }: { results: RunResult }) {
  if (!results.wtp || results.wtp.length === 0)
    return <p className="text-sm text-ink-soft">This run has no cost coefficient, so no WTP.</p>;
  const label = new Map(results.columns.map((c) => [c.coefficient, c.label]));
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm">
        <caption className="sr-only">Willingness to pay</caption>
        <thead>
          <tr className="border-b border-line text-xs text-ink-soft">
            <th scope="col" className="px-2 py-2 text-left font-medium">
              Attribute column
            </th>
            {['WTP', 'SE (delta)', 'Delta-method 95 %', 'Krinsky–Robb 95 %'].map((h) => (
              <th key={h} scope="col" className="px-2 py-2 text-right font-medium">
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
              <td className="num px-2 py-1.5">{formatNumber(w.estimate, 2)}</td>
              <td className="num px-2 py-1.5">{formatNumber(w.se, 2)}</td>
              <td className="num px-2 py-1.5">
                {formatNumber(w.deltaLower, 2)} to {formatNumber(w.deltaUpper, 2)}
              </td>
              <td className="num px-2 py-1.5">
                {formatNumber(w.lower, 2)} to {formatNumber(w.upper, 2)}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
