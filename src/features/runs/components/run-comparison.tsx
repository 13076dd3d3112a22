/**
 * Finished runs of any family side by side: fit (log-likelihood, ρ², adjusted ρ², AIC, BIC,
 * CAIC, HB's log marginal density, hit rates with population and individual estimates), every
 * parameter's estimate with its standard error below, and every coefficient's population mean.
 */
import type { Run, RunResult } from '@shared/schemas/run';
import { formatNumber, formatPercent } from '@/utils/format';
import { HeaderCells } from '@/components/ui/header-cells';
import { MODEL_LABELS } from '@shared/schemas/estimation-families';
import { LikelihoodRatioTests } from './likelihood-ratio-tests';

type Row = { label: string; value: (r: RunResult) => string };

const fitRows: Row[] = [
  { label: 'Model', value: (r) => MODEL_LABELS[r.model] },
  { label: 'Respondents', value: (r) => String(r.respondents) },
  { label: 'Choice observations', value: (r) => String(r.observations) },
  { label: 'Parameters', value: (r) => String(r.parameters) },
  { label: 'Log-likelihood', value: (r) => formatNumber(r.loglik, 2) },
  { label: 'LL at zero', value: (r) => formatNumber(r.loglikNull, 2) },
  { label: 'LL constants only', value: (r) => formatNumber(r.fit?.loglikConstants, 2) },
  { label: 'Converged', value: (r) => (r.converged ? 'yes' : 'no') },
  { label: 'ρ²', value: (r) => formatNumber(r.rho2, 4) },
  { label: 'Adjusted ρ²', value: (r) => formatNumber(r.adjRho2, 4) },
  { label: 'AIC', value: (r) => formatNumber(r.aic, 1) },
  { label: 'BIC', value: (r) => formatNumber(r.bic, 1) },
  { label: 'CAIC', value: (r) => formatNumber(r.fit?.caic ?? r.caic, 1) },
  // HB: the Newton–Raphson harmonic-mean estimate (a rough guide; docs/methods.md).
  { label: 'Log marginal density (HB)', value: (r) => formatNumber(r.logMarginalDensity, 2) },
  { label: 'Hit rate', value: (r) => formatPercent(r.hitRate) },
  { label: 'Holdout hit rate', value: (r) => formatPercent(r.holdoutHitRate) },
  // HB and latent class: each respondent's own estimates (posterior or class-weighted means).
  { label: 'Hit rate, individual estimates', value: (r) => formatPercent(r.individualHitRate) },
  {
    label: 'Holdout hit rate, individual estimates',
    value: (r) => formatPercent(r.individualHoldoutHitRate),
  },
];

export function RunComparison({ runs }: { runs: Run[] }) {
  const done = runs.filter((r): r is Run & { results: RunResult } => r.results !== null);
  // An MNL's "bill" sits on the same row as a mixed logit's "bill.mean" when that location is
  // the coefficient's mean (normal, triangular, uniform); a lognormal's is of ln |β|: own row.
  const rowOf = (results: RunResult, name: string) => {
    const [coef, part] = name.split('.');
    const dist = results.population.find((m) => m.name === coef)?.distribution;
    const row = part === 'mean' && dist !== 'lognormal' && dist !== 'neg_lognormal' ? coef : name;
    // In WTP space the non-cost parameters are WTPs, not utility coefficients: own rows.
    const cost = runs.find((r) => r.results === results)?.spec.cost;
    return results.space === 'wtp' && coef !== cost ? `${row} (WTP space)` : row;
  };
  // Every coefficient's population mean of β itself, comparable across the families: the MNL
  // estimate, the mixed logit's and HB's mean of the distribution (of β, also for lognormals),
  // the latent class share-weighted mean of the class coefficients.
  const coefficients = [...new Set(done.flatMap((r) => r.results.population.map((m) => m.name)))];
  const names = [
    ...new Set(done.flatMap((r) => r.results.estimates.map((e) => rowOf(r.results, e.name)))),
  ];
  return (
    <div className="space-y-4">
      <div className="overflow-x-auto rounded-lg border border-line bg-white">
        <table className="w-full text-sm">
          <caption className="sr-only">Comparison of the selected runs</caption>
          <thead>
            <tr className="border-b border-line text-left">
              <HeaderCells
                className="px-3 py-2 font-medium"
                headings={[
                  {
                    label: 'Statistic',
                    align: 'left',
                    className: 'sticky left-0 bg-white text-ink-soft',
                  },
                  ...done.map((r) => ({
                    label: r.name,
                    align: 'right' as const,
                    key: r.id,
                    className: 'text-ink',
                  })),
                ]}
              />
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
                  const e = r.results.estimates.find((x) => rowOf(r.results, x.name) === name);
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
            {coefficients.map((coef) => (
              <tr key={`${coef}-population`} className="border-b border-line/60 last:border-b-0">
                <th
                  scope="row"
                  className="sticky left-0 bg-white px-3 py-1.5 text-left font-mono text-xs font-normal"
                >
                  {coef}: population mean of β
                </th>
                {done.map((r) => {
                  const m = r.results.population.find((x) => x.name === coef);
                  return (
                    <td key={r.id} className="num px-3 py-1.5">
                      {m ? formatNumber(m.mean) : '—'}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
        <p className="px-3 py-2 text-xs text-ink-muted">
          Standard errors (HB: posterior SDs) in brackets. For lognormal coefficients, .mean and .sd
          are the mean and SD of ln |β|; the “population mean of β” rows give each coefficient’s own
          population mean in every model; .sd rows are spreads (SD for normals, half-width for
          triangular and uniform).
        </p>
      </div>
      <LikelihoodRatioTests runs={done} />
    </div>
  );
}
