/**
 * A vertical list reordered by drag and drop (pointer, touch or keyboard: focus a handle,
 * Space to lift, arrows to move, Space to drop, Escape to cancel).
 */
import type { ReactNode } from 'react';
import { useSortable } from '@dnd-kit/sortable';
import { CSS } from '@dnd-kit/utilities';
import { cn } from '@/lib/cn';
import { createSortableAnnouncements } from '@/lib/sortable-announcements';
import { VerticalSortable } from '@/components/ui/vertical-sortable';

type Props<T extends { id: string }> = {
  items: T[];
  onMove: (from: number, to: number) => void;
  renderItem: (item: T, index: number, handle: ReactNode) => ReactNode;
  /** Names the item in the handle's label, e.g. "Reorder level Poor". */
  itemName: (item: T) => string;
  disabled?: boolean;
  className?: string;
};

export function SortableList<T extends { id: string }>({
  items,
  onMove,
  renderItem,
  itemName,
  disabled,
  className,
}: Props<T>) {
  // Spoken by screen readers: names and positions rather than internal ids.
  const announcements = createSortableAnnouncements(
    items.map((i) => i.id),
    (id) => {
      const item = items.find((i) => i.id === id);
      return item ? itemName(item) : 'item';
    },
  );
  return (
    <VerticalSortable
      ids={items.map((i) => i.id)}
      onMove={onMove}
      announcements={announcements}
      instructions="To move this item, press Space or Enter, use the arrow keys to move it, then press Space or Enter to drop it, or Escape to cancel."
    >
      <ul className={className}>
        {items.map((item, index) => (
          <SortableItem
            key={item.id}
            id={item.id}
            label={`Reorder ${itemName(item)}`}
            disabled={disabled}
          >
            {(handle) => renderItem(item, index, handle)}
          </SortableItem>
        ))}
      </ul>
    </VerticalSortable>
  );
}

function SortableItem({
  id,
  label,
  disabled,
  children,
}: {
  id: string;
  label: string;
  disabled?: boolean;
  children: (handle: ReactNode) => ReactNode;
}) {
  const {
    attributes,
    listeners,
    setNodeRef,
    setActivatorNodeRef,
    transform,
    transition,
    isDragging,
  } = useSortable({ id, disabled });
  // A read-only list shows no grip at all: a faded grip still reads as "drag me".
  const handle = disabled ? (
    <span aria-hidden className="size-10 shrink-0" />
  ) : (
    <button
      type="button"
      ref={setActivatorNodeRef}
      aria-label={label}
      className="flex size-10 shrink-0 cursor-grab touch-none items-center justify-center rounded-md text-ink-muted hover:bg-primary-soft hover:text-primary"
      {...attributes}
      {...listeners}
    >
      <svg aria-hidden viewBox="0 0 20 20" className="size-5" fill="currentColor">
        <circle cx="7" cy="5" r="1.5" />
        <circle cx="13" cy="5" r="1.5" />
        <circle cx="7" cy="10" r="1.5" />
        <circle cx="13" cy="10" r="1.5" />
        <circle cx="7" cy="15" r="1.5" />
        <circle cx="13" cy="15" r="1.5" />
      </svg>
    </button>
  );
  return (
    <li
      ref={setNodeRef}
      style={{ transform: CSS.Transform.toString(transform), transition }}
      className={cn('relative', isDragging && 'z-10 opacity-80 shadow-lg')}
    >
      {children(handle)}
    </li>
  );
}
