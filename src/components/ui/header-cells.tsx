/**
 * The column headings of a table: one `th scope="col"` each, with the table's own cell class
 * and each column's alignment (figures right, text left), so a heading sits over its values.
 */
import type { ReactNode } from 'react';
import { cn } from '@/lib/cn';

type Align = 'left' | 'right';
/**
 * A heading's text (aligned left), or its text and alignment (and classes of its own, added to
 * the table's, such as a sticky first column); false leaves the column out.
 */
export type ColumnHeading =
  string | { label: ReactNode; align: Align; key?: string; className?: string } | false | null;

const alignClass: Record<Align, string> = { left: 'text-left', right: 'text-right' };

export function HeaderCells({
  headings,
  className,
}: {
  headings: ColumnHeading[];
  /** The padding and weight of the table's heading cells. */
  className: string;
}) {
  return (
    <>
      {headings.map((h, i) => {
        if (!h) return null;
        const {
          label,
          align,
          key,
          className: own,
        } = typeof h === 'string' ? { label: h, align: 'left' as const, key: h, className: '' } : h;
        return (
          <th key={key ?? i} scope="col" className={cn(className, own, alignClass[align])}>
            {label}
          </th>
        );
      })}
    </>
  );
}
