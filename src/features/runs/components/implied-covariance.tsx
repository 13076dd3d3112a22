/**
 * Correlated mixed logit: the covariance matrix Σ = LL′ and the correlation matrix implied by
 * the estimated Cholesky factor L (Train 2009 §6.3), each cell with its delta-method SE, rows
 * and columns named by the study's readable labels.
 */
import type { RunResult } from '@shared/schemas/run';
import { formatNumber } from '@/utils/format';
import { getLabelOf } from '@shared/results/parameter-labels';

type Derived = NonNullable<RunResult['derived']>[number];

function Matrix({
  title,
  names,
  cell,
  labelOf,
}: {
  title: string;
  names: string[];
  cell: (a: string, b: string) => Derived | 'one' | undefined;
  labelOf: (n: string) => string;
}) {
  return (
    <div className="overflow-x-auto">
      <table className="text-sm">
        <caption className="mb-1 text-left text-sm font-medium text-ink">{title}</caption>
        <thead>
          <tr className="border-b border-line text-xs text-ink-soft">
            <td />
            {names.map((n) => (
              <th key={n} scope="col" className="max-w-40 px-2 py-2 text-right font-medium">
                {labelOf(n)}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {names.map((a) => (
            <tr key={a} className="border-b border-line/60 last:border-b-0">
              <th scope="row" className="max-w-56 px-2 py-1.5 text-left font-normal text-ink">
                {labelOf(a)}
              </th>
              {names.map((b) => {
                const c = cell(a, b);
                return (
                  <td key={b} className="num px-2 py-1.5 whitespace-nowrap">
                    {c === 'one' ? (
                      '1'
                    ) : c ? (
                      <>
                        {formatNumber(c.estimate)}
                        <span className="block text-xs text-ink-muted">
                          SE {formatNumber(c.se)}
                        </span>
                      </>
                    ) : (
                      '—'
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

export function ImpliedCovariance({ results }: { results: RunResult }) {
  const derived = results.derived ?? [];
  const covariance = derived.filter((d) => d.quantity === 'covariance');
  const correlation = derived.filter((d) => d.quantity === 'correlation');
  if (covariance.length === 0 && correlation.length === 0) return null;
  const labelOf = getLabelOf(results);
  const names = [...new Set([...covariance, ...correlation].flatMap((d) => d.name.split('~')))];
  const find = (list: Derived[], a: string, b: string) =>
    list.find((d) => d.name === `${a}~${b}` || d.name === `${b}~${a}`);
  const used = results.covariance?.used === 'classical' ? 'classical' : 'robust';
  return (
    <div className="space-y-6">
      {covariance.length > 0 && (
        <Matrix
          title="Implied covariance matrix of the correlated tastes"
          names={names}
          labelOf={labelOf}
          cell={(a, b) => find(covariance, a, b)}
        />
      )}
      <Matrix
        title="Implied correlation matrix"
        names={names}
        labelOf={labelOf}
        cell={(a, b) => (a === b ? 'one' : find(correlation, a, b))}
      />
      <p className="text-xs text-ink-muted">
        Σ = LL′ from the Cholesky terms in the parameter table; SEs by the delta method from the{' '}
        {used} covariance of the estimates. Intervals are in the derived quantities download.
      </p>
    </div>
  );
}
