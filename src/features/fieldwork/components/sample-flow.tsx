import type { FieldworkStats } from '@shared/schemas/fieldwork';
import { formatCount, formatDuration, formatPercent } from '@/utils/format';
import { StatTile } from './stat-tile';

/** Starts, completes, screen-outs, over-quota, completion rate and median time. */
export function SampleFlow({ stats }: { stats: FieldworkStats }) {
  const c = stats.counts;
  return (
    <dl className="grid grid-cols-2 gap-2 sm:grid-cols-4 sm:gap-3 xl:grid-cols-7">
      <StatTile label="Starts" value={formatCount(c.starts)} />
      <StatTile label="Completes" value={formatCount(c.completed)} tone="primary" />
      <StatTile label="In progress" value={formatCount(c.inProgress)} hint="not finished yet" />
      <StatTile label="Screened out" value={formatCount(c.screenedOut)} />
      <StatTile label="Over quota" value={formatCount(c.overQuota)} />
      <StatTile
        label="Completion rate"
        value={formatPercent(stats.completionRate, 0)}
        hint="of starts not screened out"
      />
      <StatTile
        label="Median time"
        value={formatDuration(stats.medianDurationMs)}
        hint="of completes"
      />
    </dl>
  );
}
