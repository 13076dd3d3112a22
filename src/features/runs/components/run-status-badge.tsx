import type { RunStatus } from '@shared/schemas/run';
import { Badge, type BadgeTone } from '@/components/ui/badge';

const look: Record<RunStatus, { label: string; tone: BadgeTone }> = {
  queued: { label: 'Queued', tone: 'neutral' },
  running: { label: 'Running', tone: 'primary' },
  done: { label: 'Done', tone: 'success' },
  failed: { label: 'Failed', tone: 'danger' },
  cancelled: { label: 'Cancelled', tone: 'accent' },
};

export function RunStatusBadge({ status }: { status: RunStatus }) {
  const { label, tone } = look[status];
  return (
    <Badge tone={tone} strong>
      {label}
    </Badge>
  );
}
