import type { Role } from '@shared/permissions';

export const roleLabels: Record<Role, string> = {
  owner: 'Owner',
  editor: 'Editor',
  analyst: 'Analyst',
  viewer: 'Viewer',
};
