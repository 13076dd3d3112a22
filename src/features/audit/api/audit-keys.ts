import type { ListAuditQuery } from '@shared/schemas/audit';

export const auditKeys = {
  all: ['audit'] as const,
  lists: (teamId: string) => [...auditKeys.all, teamId, 'list'] as const,
  list: (teamId: string, filters: Partial<ListAuditQuery>) =>
    [...auditKeys.lists(teamId), filters] as const,
};
