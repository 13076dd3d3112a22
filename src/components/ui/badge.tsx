import type { ReactNode } from 'react';
import { cn } from '@/lib/cn';

export type BadgeTone = 'neutral' | 'primary' | 'accent' | 'success' | 'danger';
const tones: Record<BadgeTone, string> = {
  neutral: 'border-line bg-canvas text-ink-soft',
  primary: 'border-primary/30 bg-primary-soft text-primary-strong',
  accent: 'border-accent/50 bg-accent-soft text-ink',
  success: 'border-success/30 bg-success-soft text-success',
  danger: 'border-danger/30 bg-danger-soft text-danger',
};

/** A short label such as a role or a state; `strong` for states that must stand out in a list. */
export function Badge({
  tone = 'neutral',
  strong = false,
  children,
  className,
}: {
  tone?: BadgeTone;
  strong?: boolean;
  children: ReactNode;
  className?: string;
}) {
  return (
    <span
      className={cn(
        'inline-flex items-center rounded-full border px-2 py-0.5 text-xs',
        strong ? 'font-semibold' : 'font-medium',
        tones[tone],
        className,
      )}
    >
      {children}
    </span>
  );
}
