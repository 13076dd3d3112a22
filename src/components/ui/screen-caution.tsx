/**
 * One caution per screen: a short line, the full text behind "Details", and a Dismiss that
 * this browser remembers for that screen (Show caution brings it back). Screens used to stack
 * several "read with care" banners; people stop reading repeated banners, so each screen says
 * it once and docs/methods.md ("Reading results: cautions") holds the whole text.
 */
import { useState, type ReactNode } from 'react';
import { Alert } from './feedback';

const storageKey = (screen: string) => `choicewright.caution-dismissed.${screen}`;

function readDismissed(screen: string): boolean {
  try {
    return window.localStorage.getItem(storageKey(screen)) === '1';
  } catch {
    return false; // storage blocked (private mode): show the caution
  }
}

function writeDismissed(screen: string, dismissed: boolean) {
  try {
    if (dismissed) window.localStorage.setItem(storageKey(screen), '1');
    else window.localStorage.removeItem(storageKey(screen));
  } catch {
    // storage blocked: dismissal lasts for this page view only
  }
}

export function ScreenCaution({
  screen,
  summary,
  children,
}: {
  /** Stable name of the screen, e.g. "tastes"; dismissal is remembered per screen. */
  screen: string;
  summary: ReactNode;
  children: ReactNode;
}) {
  const [dismissed, setDismissed] = useState(() => readDismissed(screen));
  const toggle = (value: boolean) => {
    writeDismissed(screen, value);
    setDismissed(value);
  };
  if (dismissed)
    return (
      <button
        type="button"
        className="text-xs text-ink-muted underline hover:text-ink"
        onClick={() => toggle(false)}
      >
        Show caution
      </button>
    );
  return (
    <Alert tone="warning">
      <div className="flex items-start justify-between gap-3">
        <p>{summary}</p>
        <button
          type="button"
          className="shrink-0 text-xs font-medium text-ink-soft underline hover:text-ink"
          onClick={() => toggle(true)}
        >
          Dismiss
        </button>
      </div>
      <details className="mt-1">
        <summary className="cursor-pointer text-xs font-medium text-ink-soft">Details</summary>
        <div className="mt-2">{children}</div>
      </details>
    </Alert>
  );
}
