import type { ReactNode } from 'react';
import { useInterfaceText } from '@/lib/interface-texts';

/**
 * The respondent's page: a thin progress bar on top with, below it, a quiet note when answers
 * wait for the connection (never a blocking error), the study's public title, one screen.
 * `wide`: the screen uses the wide frame (isWideScreen), and the title lines up with it.
 */
export function RespondLayout({
  progress,
  studyName,
  pending = 0,
  offline = false,
  wide = false,
  children,
}: {
  progress: number;
  studyName?: string;
  pending?: number;
  offline?: boolean;
  wide?: boolean;
  children: ReactNode;
}) {
  const t = useInterfaceText();
  const pct = Math.round(Math.max(0, Math.min(1, progress)) * 100);
  const column = wide ? 'mx-auto max-w-5xl' : 'mx-auto max-w-2xl';
  return (
    <div className="flex min-h-dvh flex-col bg-canvas">
      {/* Progress and the offline notice stay at the top of the screen, clear of the Next bar. */}
      <div className="sticky top-0 z-20">
        <div
          role="progressbar"
          aria-label={t('ui.progress')}
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuenow={pct}
          className="h-1.5 w-full bg-line"
        >
          <div
            className="h-full bg-primary transition-[width] duration-300"
            style={{ width: `${pct}%` }}
          />
        </div>
        <div aria-live="polite">
          {pending > 0 && offline && (
            <p className="border-b border-accent/50 bg-accent-soft px-4 py-2 text-sm text-ink">
              <span className={`${column} block`}>{t('ui.offline')}</span>
            </p>
          )}
        </div>
      </div>
      <header className="px-4 pt-4 sm:pt-6">
        <p className={`${column} truncate text-sm text-ink-muted`}>{studyName ?? '\u00a0'}</p>
      </header>
      <main id="main" className="flex-1 px-4 pb-8 pt-3 sm:pt-6">
        {children}
      </main>
    </div>
  );
}
