import type { ReactNode } from 'react';
import { Link } from 'react-router';

/** The way back up to the list or section a page was opened from, shown above its title. */
export function BackLink({ to, children }: { to: string; children: ReactNode }) {
  return (
    <Link to={to} className="text-sm text-ink-muted hover:text-primary">
      ← {children}
    </Link>
  );
}
