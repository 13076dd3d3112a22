import type { ReactNode } from 'react';

export type Option = { value: string | number; label: ReactNode };

/** The options of a select, one per item, keyed by their value (values are unique in a select). */
export function Options({ items }: { items: Option[] }) {
  return (
    <>
      {items.map((o) => (
        <option key={o.value} value={o.value}>
          {o.label}
        </option>
      ))}
    </>
  );
}
