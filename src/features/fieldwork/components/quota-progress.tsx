import type { QuotaProgress } from '@shared/schemas/fieldwork';
import { Badge } from '@/components/ui/badge';
import { formatCount } from '@/utils/format';

/**
 * Completes per segment quota cell against its target. A full cell turns its next
 * respondents away at the screening question, so the researcher sees which groups still
 * need people (and where to point the panel's remaining invitations).
 */
export function QuotaProgressList({ quotas }: { quotas: QuotaProgress[] }) {
  return (
    <div className="space-y-5">
      {quotas.map((q) => (
        <section key={q.question} className="space-y-2">
          <h3 className="text-sm font-medium text-ink">{q.question}</h3>
          <ul className="space-y-2">
            {q.cells.map((c) => {
              const share = Math.min(1, c.completed / c.target);
              return (
                <li key={c.id} className="space-y-1">
                  <div className="flex flex-wrap items-baseline justify-between gap-x-3 text-sm">
                    <span className="min-w-0 break-words text-ink">{c.label}</span>
                    <span className="text-ink-soft">
                      <span className="num">
                        {formatCount(c.completed)} of {formatCount(c.target)}
                      </span>
                      {c.completed >= c.target && (
                        <Badge tone="accent" className="ml-2">
                          Full
                        </Badge>
                      )}
                    </span>
                  </div>
                  <div className="h-2 rounded-full bg-line/60" aria-hidden="true">
                    <div
                      className="h-2 rounded-full bg-primary"
                      style={{ width: `${(share * 100).toFixed(1)}%` }}
                    />
                  </div>
                </li>
              );
            })}
          </ul>
        </section>
      ))}
      <p className="text-xs text-ink-muted">
        Only completes count. A respondent whose group is full leaves at the screening question as
        over quota.
      </p>
    </div>
  );
}
