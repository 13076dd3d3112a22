import type { ReactNode } from 'react';
import { cn } from '@/lib/cn';

type Tone = 'neutral' | 'primary' | 'accent';
const tones: Record<Tone, string> = {
  neutral: 'border-line bg-canvas text-ink-soft',
  primary: 'border-primary/30 bg-primary-soft text-primary-strong',
  accent: 'border-accent/50 bg-accent-soft text-ink',
};

/** A short label such as a role or a state. */
export function Badge({
  tone = 'neutral',
  children,
  className,
}: {
  tone?: Tone;
  children: ReactNode;
  className?: string;
}) {
  return (
    <span
      className={cn(
        'inline-flex items-center rounded-full border px-2 py-0.5 text-xs font-medium',
        tones[tone],
        className,
      )}
    >
      {children}
    </span>
  );
}
