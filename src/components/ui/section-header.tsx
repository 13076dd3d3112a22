import type { ReactNode } from 'react';

/** A study section's title and one-line description, with the section's own controls beside them. */
export function SectionHeader({
  title,
  description,
  children,
}: {
  title: ReactNode;
  description: ReactNode;
  children?: ReactNode;
}) {
  return (
    <div className="flex flex-wrap items-end justify-between gap-3">
      <div>
        <h2 className="text-xl font-semibold text-ink">{title}</h2>
        <p className="text-sm text-ink-soft">{description}</p>
      </div>
      {children}
    </div>
  );
}
