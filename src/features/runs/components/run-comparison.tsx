/**
 * Finished runs side by side: fit (log-likelihood, ρ², adjusted ρ², AIC, BIC, hit rates) and
 * every parameter's estimate with its standard error below.
 */
import type { Run, RunResult } from '@shared/schemas/run';
import { formatNumber, formatPercent } from '../utils/format';

type Row = { label: string; value: (r: RunResult) => string };

const fitRows: Row[] = [
  { label: 'Respondents', value: (r) => String(r.respondents) },
  { label: 'Choice tasks', value: (r) => String(r.observations) },
  { label: 'Parameters', value: (r) => String(r.parameters) },
  { label: 'Log-likelihood', value: (r) => formatNumber(r.loglik, 2) },
  { label: 'LL at zero', value: (r) => formatNumber(r.loglikNull, 2) },
  { label: 'ρ²', value: (r) => formatNumber(r.rho2, 4) },
  { label: 'Adjusted ρ²', value: (r) => formatNumber(r.adjRho2, 4) },
  { label: 'AIC', value: (r) => formatNumber(r.aic, 1) },
  { label: 'BIC', value: (r) => formatNumber(r.bic, 1) },
  { label: 'Hit rate', value: (r) => formatPercent(r.hitRate) },
  { label: 'Holdout hit rate', value: (r) => formatPercent(r.holdoutHitRate) },
];

export function RunComparison({ runs }: { runs: Run[] }) {
  const done = runs.filter((r): r is Run & { results: RunResult } => r.results !== null);
  // An MNL's "bill" sits on the same row as a mixed logit's "bill.mean".
  const rowOf = (name: string) => name.replace(/\.mean$/, '');
  const names = [...new Set(done.flatMap((r) => r.results.estimates.map((e) => rowOf(e.name))))];
  return (
    <div className="overflow-x-auto rounded-lg border border-line bg-white">
      <table className="w-full text-sm">
        <caption className="sr-only">Comparison of the selected runs</caption>
        <thead>
          <tr className="border-b border-line text-left">
            <th scope="col" className="sticky left-0 bg-white px-3 py-2 font-medium text-ink-soft">
              Statistic
            </th>
            {done.map((r) => (
              <th key={r.id} scope="col" className="px-3 py-2 text-right font-medium text-ink">
                {r.name}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {fitRows.map((row) => (
            <tr key={row.label} className="border-b border-line/60">
              <th
                scope="row"
                className="sticky left-0 bg-white px-3 py-1.5 text-left font-normal text-ink-soft"
              >
                {row.label}
              </th>
              {done.map((r) => (
                <td key={r.id} className="num px-3 py-1.5">
                  {row.value(r.results)}
                </td>
              ))}
            </tr>
          ))}
          {names.map((name) => (
            <tr key={name} className="border-b border-line/60 last:border-b-0">
              <th
                scope="row"
                className="sticky left-0 bg-white px-3 py-1.5 text-left font-mono text-xs font-normal"
              >
                {name}
              </th>
              {done.map((r) => {
                const e = r.results.estimates.find((x) => rowOf(x.name) === name);
                return (
                  <td key={r.id} className="num px-3 py-1.5">
                    {e ? formatNumber(e.estimate) : '—'}
                    {e && (
                      <span className="block text-xs text-ink-muted">({formatNumber(e.se)})</span>
                    )}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
