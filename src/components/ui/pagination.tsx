/**
 * The pager of a paged table: Previous and Next around what the caller shows between them
 * (e.g. "2 / 7"). `PageButtons` alone sits in a toolbar of its own; `Pagination` is the usual
 * labelled bar under a table.
 */
import type { ReactNode } from 'react';
import { Button } from './button';

type PageButtonsProps = {
  page: number;
  pages: number;
  onPage: (page: number) => void;
  children?: ReactNode;
};

export function PageButtons({ page, pages, onPage, children }: PageButtonsProps) {
  return (
    <>
      <Button size="sm" variant="secondary" disabled={page <= 1} onClick={() => onPage(page - 1)}>
        Previous
      </Button>
      {children}
      <Button
        size="sm"
        variant="secondary"
        disabled={page >= pages}
        onClick={() => onPage(page + 1)}
      >
        Next
      </Button>
    </>
  );
}

export function Pagination({ label, ...buttons }: PageButtonsProps & { label: string }) {
  return (
    <nav aria-label={label} className="flex items-center justify-end gap-2 text-sm">
      <PageButtons {...buttons} />
    </nav>
  );
}
