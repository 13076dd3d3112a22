import type { RunStatus } from '@shared/schemas/run';
import { cn } from '@/lib/cn';

const look: Record<RunStatus, { label: string; className: string }> = {
  queued: { label: 'Queued', className: 'border-line bg-canvas text-ink-soft' },
  running: { label: 'Running', className: 'border-primary/30 bg-primary-soft text-primary-strong' },
  done: { label: 'Done', className: 'border-success/30 bg-success-soft text-success' },
  failed: { label: 'Failed', className: 'border-danger/30 bg-danger-soft text-danger' },
  cancelled: { label: 'Cancelled', className: 'border-accent/50 bg-accent-soft text-ink' },
};

export function RunStatusBadge({ status }: { status: RunStatus }) {
  const { label, className } = look[status];
  return (
    <span
      className={cn(
        'inline-flex items-center rounded-full border px-2 py-0.5 text-xs font-semibold',
        className,
      )}
    >
      {label}
    </span>
  );
}
