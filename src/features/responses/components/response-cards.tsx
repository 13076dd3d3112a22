/**
 * Respondents as cards for phone widths, where the table would hide flags and the exclude
 * control behind a horizontal scroll. Same content as ResponsesTable.
 */
import type { ResponseListViewProps } from './responses-table';
import { FlagBadges } from './flag-badges';
import { InclusionCell } from './inclusion-cell';
import { formatDate, formatDuration } from '@/utils/format';
import { statusLabels } from '../utils/labels';
import { cn } from '@/lib/cn';

export function ResponseCards({ teamId, studyId, list, canManage }: ResponseListViewProps) {
  return (
    <ul className="space-y-2" aria-label="Respondents">
      {list.items.map((r) => (
        <li
          key={r.id}
          className={cn('rounded-lg border border-line p-3', r.included ? 'bg-white' : 'bg-canvas')}
        >
          <div className="flex items-baseline justify-between gap-2">
            <span className="font-mono text-xs text-ink-soft">{r.id.slice(0, 8)}</span>
            <span className="font-mono text-sm tabular-nums text-ink">
              {formatDuration(r.durationMs)}
            </span>
          </div>
          <p className="mt-1 text-sm text-ink">
            {statusLabels[r.status]}
            <span className="text-ink-muted">
              {' '}
              · version {r.version} · block {r.block}
              {list.languages.length > 1 && ` · ${r.language}`} · {formatDate(r.startedAt)}
            </span>
          </p>
          {list.personalData && (r.externalId || r.email) && (
            <p className="mt-1 truncate font-mono text-xs text-ink-soft">
              {[r.externalId, r.email].filter(Boolean).join(' · ')}
            </p>
          )}
          <div className="mt-2 flex flex-wrap items-start justify-between gap-2">
            <FlagBadges flags={r.flags} />
            <InclusionCell teamId={teamId} studyId={studyId} row={r} canManage={canManage} />
          </div>
        </li>
      ))}
    </ul>
  );
}
