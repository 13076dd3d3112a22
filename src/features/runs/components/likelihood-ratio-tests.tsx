/** Likelihood-ratio tests between the compared runs (utils/likelihood-ratio.ts). */
import type { Run, RunResult } from '@shared/schemas/run';
import { compareAllPairs } from '../utils/likelihood-ratio';
import { formatNumber, formatPValue } from '@/utils/format';

export function LikelihoodRatioTests({ runs }: { runs: (Run & { results: RunResult })[] }) {
  if (runs.length < 2) return null;
  const tests = compareAllPairs(runs);
  return (
    <div className="space-y-2">
      <h4 className="text-sm font-semibold text-ink">Likelihood-ratio tests</h4>
      <ul className="space-y-2 text-sm">
        {tests.map((t, i) =>
          t.nested ? (
            <li key={i} className="rounded-md border border-line bg-white px-3 py-2">
              <span className="font-medium">{t.restricted.name}</span> is nested in{' '}
              <span className="font-medium">{t.general.name}</span>: LR ={' '}
              <span className="num">{formatNumber(t.statistic, 2)}</span>, df ={' '}
              <span className="num">{t.df}</span>, p ={' '}
              <span className="num">{formatPValue(t.p)}</span>
              {t.note && <span className="block text-xs text-ink-muted">Note: {t.note}.</span>}
            </li>
          ) : (
            <li key={i} className="rounded-md border border-line bg-canvas px-3 py-2 text-ink-soft">
              {t.a.name} and {t.b.name} are not nested, so no likelihood-ratio test: {t.reason}.
              Compare them by AIC or BIC instead.
            </li>
          ),
        )}
      </ul>
    </div>
  );
}
