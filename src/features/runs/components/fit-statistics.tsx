import type { RunResult } from '@shared/schemas/run';
import { drawsTypeLabels } from '@shared/schemas/estimation-spec';
import { describeConvergence } from '../utils/convergence';
import { formatNumber, formatPercent } from '@/utils/format';

/** Fit statistics and what the run used, as a definition list. */
export function FitStatistics({ results }: { results: RunResult }) {
  const items: [string, string][] = [
    ['Log-likelihood', formatNumber(results.loglik, 3)],
    ['Log-likelihood at zero, LL(0)', formatNumber(results.loglikNull, 3)],
    ['LL with constants only, LL(C)', formatNumber(results.fit?.loglikConstants, 3)],
    ['ρ² against LL(0)', formatNumber(results.rho2, 4)],
    ['Adjusted ρ² against LL(0)', formatNumber(results.adjRho2, 4)],
    ['ρ² against LL(C)', formatNumber(results.fit?.rho2Constants, 4)],
    ['AIC', formatNumber(results.aic, 2)],
    [
      `BIC (n = ${results.fit?.bicN ?? results.observations} ${results.fit?.bicBasis ?? 'choice observations'})`,
      formatNumber(results.bic, 2),
    ],
    ['CAIC (same n)', formatNumber(results.fit?.caic, 2)],
    ['Hit rate', formatPercent(results.hitRate)],
    ['Holdout hit rate', formatPercent(results.holdoutHitRate)],
    ['Respondents', String(results.respondents)],
    ['Choice observations (respondent × task)', String(results.observations)],
    ['Parameters', String(results.parameters)],
    ['Iterations', String(results.iterations)],
    ['Convergence', describeConvergence(results)],
    [
      'Final gradient norm',
      results.convergence.gradientNorm === null
        ? '—'
        : results.convergence.gradientNorm.toExponential(2),
    ],
    [
      'Draws',
      results.draws
        ? `${results.draws.count} ${drawsTypeLabels[results.draws.type]}, seed ${results.draws.seed}`
        : '—',
    ],
    [
      // Versions pool: each respondent answered the design of the version they started on.
      'Respondents per study version',
      results.data.respondentsPerVersion
        ? results.data.respondentsPerVersion
            .map((v) => `v${v.version}: ${v.respondents}`)
            .join(' · ')
        : // Runs stored before the per-version count (or fixtures without it).
          (results.data.versions ?? []).map((v) => `v${v}`).join(', ') || '—',
    ],
    ['Warm-up tasks left out', String(results.data.warmupTasksLeftOut)],
    ['Holdout tasks', String(results.data.holdoutTasks)],
  ];
  return (
    <dl className="grid grid-cols-1 gap-x-6 text-sm sm:grid-cols-2">
      {items.map(([k, v]) => (
        <div key={k} className="flex justify-between gap-4 border-b border-line/60 py-1.5">
          <dt className="text-ink-soft">{k}</dt>
          <dd className="num text-ink">{v}</dd>
        </div>
      ))}
    </dl>
  );
}
