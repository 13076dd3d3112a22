/**
 * The frame of a data table: the scroll box that keeps a wide table from widening a phone's
 * page, the caption (read by screen readers; shown where the table has a visible title), the
 * column headings and the body rows the caller gives. Tables of figures use the defaults;
 * framed lists (respondents, invitees, audit) pass their own wrapper, head and cell classes.
 */
import type { ReactNode } from 'react';
import { cn } from '@/lib/cn';
import { HeaderCells, type ColumnHeading } from './header-cells';

export type DataTableProps = {
  headings: ColumnHeading[];
  /** The body rows. */
  children: ReactNode;
  /** What the table holds; screen-reader only unless `captionClassName` shows it. */
  caption?: ReactNode;
  captionClassName?: string;
  /** The accessible name of a table without a caption. */
  label?: string;
  /** The table's own classes (width, text size). */
  className?: string;
  /** The scroll box's classes, or false where the table sits in a box of the caller's. */
  wrapperClassName?: string | false;
  headClassName?: string;
  headRowClassName?: string;
  headCellClassName?: string;
  /** A row under the headings, such as a row of filters or a second heading line. */
  headExtra?: ReactNode;
  /**
   * Columns flush with the text around the table (no side padding but a gap between columns),
   * as in the design settings' cards; the head cells' padding then matches such rows.
   */
  flush?: boolean;
  /** Said in one row across all columns when there are no rows (false or absent: nothing). */
  empty?: ReactNode;
};

const head = {
  padded: {
    row: 'border-b border-line text-left text-xs text-ink-soft',
    cell: 'px-2 py-1.5 font-medium',
  },
  flush: {
    row: 'border-b border-line text-left text-xs text-ink-muted',
    cell: 'py-2 pr-3 font-medium last:pr-0',
  },
};

export function DataTable({
  headings,
  children,
  caption,
  captionClassName = 'sr-only',
  label,
  className = 'w-full text-sm',
  wrapperClassName = 'overflow-x-auto',
  headClassName,
  headRowClassName,
  headCellClassName,
  headExtra,
  flush = false,
  empty,
}: DataTableProps) {
  const look = flush ? head.flush : head.padded;
  const table = (
    <table className={className} aria-label={label}>
      {caption !== undefined && <caption className={captionClassName}>{caption}</caption>}
      <thead className={headClassName}>
        <tr className={headRowClassName ?? look.row}>
          <HeaderCells headings={headings} className={headCellClassName ?? look.cell} />
        </tr>
        {headExtra}
      </thead>
      <tbody>
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
  return wrapperClassName === false ? table : <div className={cn(wrapperClassName)}>{table}</div>;
}

/** A heading over a column of figures, aligned right like its values. */
export const figureHeading = (label: ReactNode, key?: string): ColumnHeading => ({
  label,
  align: 'right',
  key,
});
