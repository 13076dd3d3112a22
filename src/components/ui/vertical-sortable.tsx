/**
 * Reordering a vertical list by drag and drop with a pointer, a finger or the keyboard (focus a
 * handle, Space or Enter to lift, arrows to move, Space or Enter to drop, Escape to cancel).
 * The caller renders the items (each with @dnd-kit's useSortable) and gets the move as indices
 * into `ids`; screen readers hear the caller's announcements and instructions.
 */
import type { ReactNode } from 'react';
import {
  closestCenter,
  DndContext,
  KeyboardSensor,
  PointerSensor,
  useSensor,
  useSensors,
  type Announcements,
  type DragEndEvent,
} from '@dnd-kit/core';
import {
  SortableContext,
  sortableKeyboardCoordinates,
  verticalListSortingStrategy,
} from '@dnd-kit/sortable';

export function VerticalSortable({
  ids,
  onMove,
  announcements,
  instructions,
  children,
}: {
  /** The ids of the items that can move, in their order. */
  ids: string[];
  onMove: (from: number, to: number) => void;
  announcements: Announcements;
  /** How to move an item with the keyboard, read when a handle gets focus. */
  instructions: string;
  children: ReactNode;
}) {
  // A pointer must travel a few pixels before a drag starts, so a tap on a handle stays a tap.
  const sensors = useSensors(
    useSensor(PointerSensor, { activationConstraint: { distance: 4 } }),
    useSensor(KeyboardSensor, { coordinateGetter: sortableKeyboardCoordinates }),
  );
  const onDragEnd = (e: DragEndEvent) => {
    if (!e.over || e.active.id === e.over.id) return;
    const from = ids.indexOf(String(e.active.id));
    const to = ids.indexOf(String(e.over.id));
    if (from >= 0 && to >= 0) onMove(from, to);
  };
  return (
    <DndContext
      sensors={sensors}
      collisionDetection={closestCenter}
      onDragEnd={onDragEnd}
      accessibility={{ announcements, screenReaderInstructions: { draggable: instructions } }}
    >
      <SortableContext items={ids} strategy={verticalListSortingStrategy}>
        {children}
      </SortableContext>
    </DndContext>
  );
}
