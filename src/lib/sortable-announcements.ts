/**
 * What screen readers hear while a list is reordered with @dnd-kit: the item's name and its
 * position, never the internal id the library would otherwise read out.
 */
import type { Announcements } from '@dnd-kit/core';

type Id = string | number;

export function createSortableAnnouncements(
  ids: Id[],
  nameOf: (id: Id) => string,
  /** The position a person sees (the list's own numbering), 1-based. */
  positionOf: (id: Id) => number = (id) => ids.indexOf(id) + 1,
  total: number = ids.length,
): Announcements {
  const at = (id: Id) => `position ${positionOf(id)} of ${total}`;
  return {
    onDragStart: ({ active }) => `Picked up ${nameOf(active.id)} at ${at(active.id)}.`,
    onDragOver: ({ active, over }) =>
      over
        ? `${nameOf(active.id)} is over ${at(over.id)}.`
        : `${nameOf(active.id)} is outside the list.`,
    onDragEnd: ({ active, over }) =>
      over
        ? `${nameOf(active.id)} dropped at ${at(over.id)}.`
        : `${nameOf(active.id)} dropped where it was.`,
    onDragCancel: ({ active }) => `Moving ${nameOf(active.id)} was cancelled.`,
  };
}
