import type { StudyStatus } from '@shared/schemas/study';
import { cn } from '@/lib/cn';

const look: Record<StudyStatus, { label: string; className: string }> = {
  draft: { label: 'Draft', className: 'border-line bg-canvas text-ink-soft' },
  live: { label: 'Live', className: 'border-success/30 bg-success-soft text-success' },
  closed: { label: 'Closed', className: 'border-accent/50 bg-accent-soft text-ink' },
};

const imported = { label: 'Imported', className: 'border-primary/30 bg-primary-soft text-primary' };

/** The study's state; a study made from an imported file shows "Imported" (it has no fieldwork). */
export function StudyStatusBadge({
  status,
  source = 'fielded',
  archived,
}: {
  status: StudyStatus;
  source?: 'fielded' | 'imported';
  archived?: boolean;
}) {
  const { label, className } = source === 'imported' ? imported : look[status];
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
