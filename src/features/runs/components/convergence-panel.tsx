/**
 * The convergence verdict of a run: status, Newton decrement and largest relative gradient
 * against their tolerances, how many starting points reached the best log-likelihood, and the
 * gradient per parameter at the estimate (in the user's units and relative).
 */
import type { RunResult } from '@shared/schemas/run';
import { Badge } from '@/components/ui/badge';
import { describeConvergence } from '../utils/convergence';
import { formatNumber } from '@/utils/format';
import { DataTable, figureHeading } from '@/components/ui/data-table';

const exp = (x: number | null | undefined) =>
  x === null || x === undefined || !Number.isFinite(x) ? '—' : x.toExponential(2);

function verdict(model: RunResult['model'], ok: boolean): string {
  if (model === 'hb')
    return ok
      ? 'Every split R-hat is below the limit: the chains agree.'
      : 'Some split R-hat is above the limit: the chains disagree. Read the sampler diagnostics before you report these estimates.';
  if (model === 'latent_class')
    return ok
      ? 'EM converged from the best start; the standard errors come from the observed-data information.'
      : 'EM stopped at its iteration limit before the log-likelihood settled. Do not report these estimates.';
  return ok
    ? 'The gradient test passed: the estimate is a maximum of the log-likelihood.'
    : 'The gradient test did not pass: the estimates are not at a maximum. Do not report them.';
}

export function ConvergencePanel({ results }: { results: RunResult }) {
  const d = results.convergenceDetail;
  const ok = results.converged;
  return (
    <div className="space-y-3 text-sm">
      <p className="flex flex-wrap items-center gap-2">
        <Badge tone={ok ? 'primary' : 'accent'}>{describeConvergence(results)}</Badge>
        <span className="text-ink-soft">{verdict(results.model, ok)}</span>
      </p>
      {d && (
        <dl className="grid grid-cols-1 gap-x-6 sm:grid-cols-2">
          {(
            [
              ['Newton decrement g′A⁻¹g', `${exp(d.decrement)} (tolerance ${exp(d.tolerance)})`],
              [
                'Largest relative gradient',
                `${exp(d.maxRelativeGradient)} (tolerance ${exp(d.gradientTolerance)})`,
              ],
              ['Starting points at the best LL', `${d.startsAtBest} of ${d.starts}`],
              ['Iterations (limit per start)', `${results.iterations} (${d.maxIterations})`],
              ['Newton steps after the optimiser', String(d.newtonSteps)],
              ['Gradient check (analytic vs numeric)', exp(d.gradientCheck)],
            ] as const
          ).map(([k, v]) => (
            <div key={k} className="flex justify-between gap-4 border-b border-line/60 py-1.5">
              <dt className="text-ink-soft">{k}</dt>
              <dd className="num text-ink">{v}</dd>
            </div>
          ))}
        </dl>
      )}
      {d && (
        <details open={!ok}>
          <summary className="cursor-pointer font-medium text-primary">
            Gradient at the estimate
          </summary>
          <div className="mt-2">
            <DataTable
              caption="Gradient of the log-likelihood at the estimate"
              headCellClassName="px-2 py-1 font-medium"
              headings={['Parameter', figureHeading('∂LL/∂θ'), figureHeading('Relative')]}
            >
              {d.gradient.map((g) => (
                <tr key={g.name} className="border-b border-line/60 last:border-b-0">
                  <th scope="row" className="px-2 py-1 text-left font-mono text-xs font-normal">
                    {g.name}
                  </th>
                  <td className="num px-2 py-1">{exp(g.value)}</td>
                  <td className="num px-2 py-1">{exp(g.relative)}</td>
                </tr>
              ))}
            </DataTable>
            <p className="mt-1 text-xs text-ink-muted">
              Relative gradient: |∂LL/∂θ|·max(|θ|, 1)/max(|LL|, 1) on internally rescaled
              parameters, so it does not depend on the units of the data. Final log-likelihood{' '}
              {formatNumber(results.loglik, 4)}.
            </p>
          </div>
        </details>
      )}
    </div>
  );
}
