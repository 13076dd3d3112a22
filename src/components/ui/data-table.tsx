/**
 * The frame of a data table: the scroll box that keeps a wide table from widening a phone's
 * page, the caption (read by screen readers; shown where the table has a visible title), the
 * column headings, an optional empty-state row and the body rows the caller gives. Three looks:
 * `padded` for tables of figures, `flush` for tables whose columns line up with the text of a
 * settings card, `framed` for the long lists (respondents, invitees) in a bordered box.
 */
import type { ReactNode } from 'react';
import { cn } from '@/lib/cn';
import { HeaderCells, type ColumnHeading } from './header-cells';

export type DataTableLook = 'padded' | 'flush' | 'framed';

export type DataTableProps = {
  headings: ColumnHeading[];
  /** The body rows. */
  children: ReactNode;
  look?: DataTableLook;
  /** What the table holds; screen-reader only unless `captionClassName` shows it. */
  caption?: ReactNode;
  captionClassName?: string;
  /** The accessible name of a table without a caption. */
  label?: string;
  /** The table's own classes (width, text size). */
  className?: string;
  /** The scroll box's classes, or false where the table sits in a box of the caller's. */
  wrapperClassName?: string | false;
  headRowClassName?: string;
  headCellClassName?: string;
  /** The body's classes, such as figures set in the monospaced font. */
  bodyClassName?: string;
  /** Said in one row across all columns when there are no rows (false or absent: nothing). */
  empty?: ReactNode;
};

const looks: Record<DataTableLook, { wrapper: string; head?: string; row?: string; cell: string }> =
  {
    padded: {
      wrapper: 'overflow-x-auto',
      row: 'border-b border-line text-left text-xs text-ink-soft',
      cell: 'px-2 py-1.5 font-medium',
    },
    // No side padding but a gap after each column but the last.
    flush: {
      wrapper: 'overflow-x-auto',
      row: 'border-b border-line text-left text-xs text-ink-muted',
      cell: 'py-2 pr-3 font-medium last:pr-0',
    },
    // relative: a visually hidden heading (an actions column) is absolutely positioned, and
    // only a positioned scroll box clips it; otherwise that label alone widens a phone's page.
    framed: {
      wrapper: 'relative overflow-x-auto rounded-md border border-line',
      head: 'bg-canvas text-xs text-ink-soft',
      cell: 'px-3 py-2 font-medium',
    },
  };

export function DataTable({
  headings,
  children,
  look = 'padded',
  caption,
  captionClassName = 'sr-only',
  label,
  className = 'w-full text-sm',
  wrapperClassName,
  headRowClassName,
  headCellClassName,
  bodyClassName,
  empty,
}: DataTableProps) {
  const l = looks[look];
  const table = (
    <table className={className} aria-label={label}>
      {caption !== undefined && <caption className={captionClassName}>{caption}</caption>}
      <thead className={l.head}>
        <tr className={headRowClassName ?? l.row}>
          <HeaderCells headings={headings} className={headCellClassName ?? l.cell} />
        </tr>
      </thead>
      <tbody className={bodyClassName}>
        {empty !== undefined && empty !== false && (
          <tr>
            <td colSpan={headings.filter(Boolean).length} className="py-2 text-ink-muted">
              {empty}
            </td>
          </tr>
        )}
        {children}
      </tbody>
    </table>
  );
  if (wrapperClassName === false) return table;
  return <div className={cn(wrapperClassName ?? l.wrapper)}>{table}</div>;
}

/** A heading over a column of figures, aligned right like its values and kept on one line. */
export const figureHeading = (label: ReactNode, key?: string): ColumnHeading => ({
  label,
  align: 'right',
  key,
  className: 'whitespace-nowrap',
});
