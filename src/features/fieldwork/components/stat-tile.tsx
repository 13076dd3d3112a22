import type { ReactNode } from 'react';
import { cn } from '@/lib/cn';

/** One figure with its label; numbers in the mono face with tabular digits. */
export function StatTile({
  label,
  value,
  hint,
  tone = 'plain',
}: {
  label: string;
  value: ReactNode;
  hint?: ReactNode;
  tone?: 'plain' | 'primary';
}) {
  return (
    <div
      className={cn(
        'rounded-lg border px-3 py-3 sm:px-4',
        tone === 'primary' ? 'border-primary/30 bg-primary-soft' : 'border-line bg-white',
      )}
    >
      <dt className="text-xs font-medium text-ink-soft">{label}</dt>
      <dd className="mt-1 whitespace-nowrap font-mono text-xl font-medium tabular-nums text-ink sm:text-2xl xl:text-xl">
        {value}
      </dd>
      {hint && <dd className="mt-0.5 text-xs text-ink-muted">{hint}</dd>}
    </div>
  );
}
