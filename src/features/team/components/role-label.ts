import type { Role } from '@shared/permissions';

export const roleLabels: Record<Role, string> = {
  owner: 'Owner',
  editor: 'Editor',
  analyst: 'Analyst',
  viewer: 'Viewer',
};

export function formatDate(iso: string): string {
  return new Date(iso).toLocaleDateString(undefined, {
    year: 'numeric',
    month: 'short',
    day: 'numeric',
  });
}
