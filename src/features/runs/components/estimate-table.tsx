/**
 * The frame of a run's estimate tables (parameters, derived quantities, WTP): it scrolls
 * sideways on a phone, names itself to screen readers, heads the row labels on the left and the
 * figures on the right, and ends with the note that says how the figures were made.
 */
import type { ReactNode } from 'react';

/** A body row: a hairline between rows, none under the last. */
export const estimateRowClass = 'border-b border-line/60 last:border-b-0';

export function EstimateTable({
  caption,
  rowHeading,
  headings,
  note,
  children,
}: {
  caption: string;
  rowHeading: string;
  headings: string[];
  note: ReactNode;
  /** The body rows. */
  children: ReactNode;
}) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm">
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr className="border-b border-line text-xs text-ink-soft">
            <th scope="col" className="px-2 py-2 text-left font-medium">
              {rowHeading}
            </th>
            {headings.map((h, i) => (
              // Headings can repeat ("Delta 95 %" for the mean and the median).
              <th key={`${h}-${i}`} scope="col" className="px-2 py-2 text-right font-medium">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
      <p className="mt-2 text-xs text-ink-muted">{note}</p>
    </div>
  );
}
