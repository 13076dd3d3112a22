import type { DesignDiagnostics } from '@shared/schemas/design-diagnostics';
import { searchCriteria } from '../utils/criterion-names';
import { formatSignificant } from '@/utils/format';

/**
 * The four design criteria of a design under its priors, each with a one-line explanation,
 * the one the search minimised marked. Designs stored before the criteria existed show nothing.
 */
export function CriteriaList({ d }: { d: DesignDiagnostics }) {
  const report = d.criteria;
  if (!report) return null;
  return (
    <div>
      <h3 className="mb-2 text-sm font-semibold text-ink">
        All criteria {d.priorsKind === 'bayesian' ? '(averaged over the prior draws)' : ''}
      </h3>
      <ul className="divide-y divide-line text-sm" aria-label="Design criteria">
        {report.values.map((v) => {
          const c = searchCriteria[v.criterion];
          return (
            <li key={v.criterion} className="grid grid-cols-[1fr_auto] gap-x-3 py-2">
              <span className="font-medium text-ink">
                {c.name}
                {v.criterion === 's_estimate' && ` (t = ${report.tValue})`}
                {report.searched === v.criterion && (
                  <span className="ml-2 rounded bg-primary-soft px-1.5 text-xs font-normal text-ink">
                    minimised
                  </span>
                )}
              </span>
              <span className="num text-right font-mono tabular-nums">
                {formatSignificant(v.value)}
              </span>
              <span className="col-span-2 text-xs text-ink-muted">
                {v.unavailable ?? c.explanation}
              </span>
            </li>
          );
        })}
      </ul>
    </div>
  );
}
