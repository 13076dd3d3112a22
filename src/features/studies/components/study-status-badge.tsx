import type { StudyStatus } from '@shared/schemas/study';
import { cn } from '@/lib/cn';

const look: Record<StudyStatus, { label: string; className: string }> = {
  draft: { label: 'Draft', className: 'border-line bg-canvas text-ink-soft' },
  live: { label: 'Live', className: 'border-success/30 bg-success-soft text-success' },
  closed: { label: 'Closed', className: 'border-accent/50 bg-accent-soft text-ink' },
};

export function StudyStatusBadge({
  status,
  archived,
}: {
  status: StudyStatus;
  archived?: boolean;
}) {
  const { label, className } = look[status];
  return (
    <span className="inline-flex items-center gap-1">
      <span
        className={cn(
          'inline-flex items-center rounded-full border px-2.5 py-0.5 text-xs font-semibold',
          className,
        )}
      >
        {label}
      </span>
      {archived && (
        <span className="inline-flex items-center rounded-full border border-line px-2.5 py-0.5 text-xs text-ink-muted">
          Archived
        </span>
      )}
    </span>
  );
}
