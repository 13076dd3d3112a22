/**
 * Parameters of a run: estimate, classical and robust standard errors, t (robust), p and the
 * 95 % interval (estimate ± 1.96 robust SE, normal approximation). For a random coefficient
 * the location and spread parameters are listed (for lognormals, of ln |β|).
 */
import type { RunResult } from '@shared/schemas/run';
import { formatNumber, formatPValue } from '../utils/format';
import { twoSidedP } from '../utils/stats';

const Z95 = 1.959964;

/** What the location and spread parameters of each distribution are. */
const partLabels: Record<string, [string, string]> = {
  normal: ['mean', 'SD'],
  lognormal: ['mean of ln β', 'SD of ln β'],
  neg_lognormal: ['mean of ln(−β)', 'SD of ln(−β)'],
  triangular: ['centre', 'half-width'],
  uniform: ['centre', 'half-width'],
};

export function describeParameter(name: string, distribution: string | undefined): string | null {
  const part = name.split('.')[1];
  if (!part) return null;
  const labels = partLabels[distribution ?? ''];
  if (part === 'mean') return labels ? labels[0] : 'mean';
  if (part === 'sd') return labels ? labels[1] : 'spread';
  return part;
}

export function ParameterTable({ results }: { results: RunResult }) {
  // HB: posterior mean and SD over the kept draws; t and p belong to the classical fits.
  const bayes = results.model === 'hb';
  const label = new Map(results.columns.map((c) => [c.coefficient, c.label]));
  const distribution = new Map(results.population.map((m) => [m.name, m.distribution]));
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm">
        <caption className="sr-only">Parameter estimates</caption>
        <thead>
          <tr className="border-b border-line text-xs text-ink-soft">
            <th scope="col" className="px-2 py-2 text-left font-medium">
              Parameter
            </th>
            {(bayes
              ? ['Posterior mean', 'Posterior SD', '95 % interval']
              : ['Estimate', 'SE', 'Robust SE', 't', 'p', '95 % interval']
            ).map((h) => (
              <th key={h} scope="col" className="px-2 py-2 text-right font-medium">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {results.estimates.map((e) => {
            const se = e.robustSe ?? e.se;
            const t = se ? e.estimate / se : null;
            const coef = e.name.split('.')[0];
            const part = describeParameter(e.name, distribution.get(coef));
            return (
              <tr key={e.name} className="border-b border-line/60 last:border-b-0">
                <th scope="row" className="px-2 py-1.5 text-left font-normal">
                  <span className="block text-ink">
                    {label.get(coef) ?? coef}
                    {part && (
                      <span className="text-ink-muted"> — {part === 'sd' ? 'spread' : part}</span>
                    )}
                  </span>
                  <span className="block font-mono text-xs text-ink-muted">{e.name}</span>
                </th>
                <td className="num px-2 py-1.5">{formatNumber(e.estimate)}</td>
                <td className="num px-2 py-1.5">{formatNumber(e.se)}</td>
                {!bayes && (
                  <>
                    <td className="num px-2 py-1.5">{formatNumber(e.robustSe)}</td>
                    <td className="num px-2 py-1.5">{formatNumber(t, 2)}</td>
                    <td className="num px-2 py-1.5">
                      {formatPValue(t === null ? null : twoSidedP(t))}
                    </td>
                  </>
                )}
                <td className="num px-2 py-1.5">
                  {se
                    ? `${formatNumber(e.estimate - Z95 * se)} to ${formatNumber(e.estimate + Z95 * se)}`
                    : '—'}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <p className="mt-2 text-xs text-ink-muted">
        {bayes
          ? 'Posterior means and SDs over the kept draws of all chains; intervals are mean ± 1.96 posterior SD. Read them only when the sampler diagnostics show converged chains.'
          : 't, p and intervals use the robust (respondent-clustered) standard errors and the normal approximation.'}
      </p>
    </div>
  );
}
