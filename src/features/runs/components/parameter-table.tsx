/**
 * Parameters of a run: estimate, classical and robust standard errors, t (robust), p and the
 * 95 % interval (estimate ± 1.96 robust SE, normal approximation). For a random coefficient
 * the location and spread parameters are listed (for lognormals, of ln |β|); spreads as |s|.
 */
import type { RunResult } from '@shared/schemas/run';
import { formatInterval, formatNumber, formatPValue } from '@/utils/format';
import { getParameterRows } from '@shared/results/parameter-rows';
import { isSpreadParameter, SPREAD_NOTE } from '@shared/results/spread';
import { EstimateTable, estimateRowClass } from './estimate-table';

export function ParameterTable({ results }: { results: RunResult }) {
  // HB: posterior mean and SD over the kept draws; t and p belong to the classical fits.
  const bayes = results.model === 'hb';
  const hasSpreads = results.estimates.some((e) => isSpreadParameter(e.name));
  return (
    <EstimateTable
      caption="Parameter estimates"
      rowHeading="Parameter"
      headings={
        bayes
          ? ['Posterior mean', 'Posterior SD', '95 % interval']
          : ['Estimate', 'SE', 'Robust SE', 't', 'p', '95 % interval']
      }
      note={
        <>
          {bayes
            ? 'Posterior means and SDs over the kept draws of all chains; intervals are mean ± 1.96 posterior SD. Read them only when the sampler diagnostics show converged chains.'
            : 't, p and intervals use the robust (respondent-clustered) standard errors and the normal approximation.'}
          {hasSpreads && ` ${SPREAD_NOTE}`}
        </>
      }
    >
      {getParameterRows(results).map((row) => (
        <tr key={row.name} className={estimateRowClass}>
          <th scope="row" className="px-2 py-1.5 text-left font-normal">
            <span className="block text-ink">
              {row.label}
              {row.part && <span className="text-ink-muted"> — {row.part}</span>}
            </span>
            <span className="block font-mono text-xs text-ink-muted">{row.name}</span>
          </th>
          <td className="num px-2 py-1.5">
            {row.spread ? `|s| ${formatNumber(row.estimate)}` : formatNumber(row.estimate)}
          </td>
          <td className="num px-2 py-1.5">{formatNumber(row.se)}</td>
          {!bayes && (
            <>
              <td className="num px-2 py-1.5">{formatNumber(row.robustSe)}</td>
              <td className="num px-2 py-1.5">{formatNumber(row.t, 2)}</td>
              <td className="num px-2 py-1.5">{formatPValue(row.p)}</td>
            </>
          )}
          <td className="num px-2 py-1.5">{formatInterval(row.lower, row.upper)}</td>
        </tr>
      ))}
    </EstimateTable>
  );
}
