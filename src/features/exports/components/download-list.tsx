/** Download links: plain anchors to the export endpoints (the browser keeps the session cookie). */
import type { ReactNode } from 'react';

export type DownloadItem = {
  key: string;
  title: string;
  description: ReactNode;
  /** A link the run cannot give (e.g. WTP without a cost) is greyed with its reason. */
  links: { label: string; href: string; newTab?: boolean; disabledReason?: string | null }[];
  disabledReason?: string;
};

export function DownloadList({ items }: { items: DownloadItem[] }) {
  return (
    <ul className="divide-y divide-line rounded-lg border border-line bg-white">
      {items.map((item) => (
        <li
          key={item.key}
          className="flex flex-col gap-3 p-4 sm:flex-row sm:items-center sm:justify-between"
        >
          <div className="min-w-0">
            <p className="font-medium text-ink">{item.title}</p>
            <p className="text-sm text-ink-soft">{item.description}</p>
            {item.disabledReason && (
              <p className="mt-1 text-xs text-ink-muted">{item.disabledReason}</p>
            )}
            {!item.disabledReason &&
              item.links
                .filter((l) => l.disabledReason)
                .map((l) => (
                  <p key={l.label} className="mt-1 text-xs text-ink-muted">
                    {l.label}: {l.disabledReason}
                  </p>
                ))}
          </div>
          {!item.disabledReason && (
            <div className="flex flex-wrap gap-2 sm:max-w-[45%] sm:shrink-0 sm:justify-end">
              {item.links.map((l) =>
                l.disabledReason ? (
                  <span
                    key={l.label}
                    role="link"
                    aria-disabled="true"
                    title={l.disabledReason}
                    className="inline-flex h-9 cursor-not-allowed items-center rounded-md border border-line bg-canvas px-3 text-sm font-medium text-ink-muted"
                  >
                    {l.label}
                  </span>
                ) : (
                  <a
                    key={l.label}
                    href={l.href}
                    {...(l.newTab ? { target: '_blank', rel: 'noopener' } : { download: '' })}
                    className="inline-flex h-9 items-center rounded-md border border-line bg-white px-3 text-sm font-medium text-ink hover:border-primary hover:text-primary"
                  >
                    {l.label}
                  </a>
                ),
              )}
            </div>
          )}
        </li>
      ))}
    </ul>
  );
}
