/**
 * Counts per quality flag; each one filters the table. Flags inform the decision, they do not
 * make it: the cautions say so.
 */
import {
  qualityFlagKeys,
  qualityFlagLabels,
  type QualityFlagKey,
  type ResponsesSummary,
} from '@shared/schemas/responses';
import { cn } from '@/lib/cn';
import { formatDuration } from '@/utils/format';

export function QualitySummary({
  summary,
  active,
  onPick,
}: {
  summary: ResponsesSummary;
  active: QualityFlagKey | 'any' | undefined;
  onPick: (flag: QualityFlagKey | 'any' | undefined) => void;
}) {
  const tile = (key: QualityFlagKey | 'any', label: string, count: number, help: string) => (
    <li key={key}>
      <button
        type="button"
        aria-pressed={active === key}
        title={help}
        onClick={() => onPick(active === key ? undefined : key)}
        className={cn(
          'flex h-full w-full flex-col rounded-lg border px-3 py-2 text-left transition-colors',
          active === key
            ? 'border-primary bg-primary-soft'
            : 'border-line bg-white hover:border-primary',
        )}
      >
        <span className="text-xs font-medium text-ink-soft">{label}</span>
        <span className="font-mono text-xl tabular-nums text-ink">{count}</span>
      </button>
    </li>
  );
  return (
    <div className="space-y-2">
      <ul className="grid grid-cols-2 gap-2 sm:grid-cols-3 lg:grid-cols-6">
        {tile('any', 'Any flag', summary.anyFlag, 'Respondents with at least one flag')}
        {qualityFlagKeys.map((k) =>
          tile(k, qualityFlagLabels[k].label, summary.flagged[k], qualityFlagLabels[k].help),
        )}
      </ul>
      <p className="text-xs text-ink-muted">
        {summary.completed} completed of {summary.respondents}; {summary.excluded} excluded from
        estimation. Median time {formatDuration(summary.medianDurationMs)}
        {summary.speederThresholdMs !== null
          ? `; speeders are under ${formatDuration(summary.speederThresholdMs)}.`
          : '; speeders are judged once 10 respondents have completed.'}
      </p>
    </div>
  );
}
