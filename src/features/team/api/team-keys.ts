/** Query keys of the team feature, broad to narrow. */
export const teamKeys = {
  all: ['teams'] as const,
  lists: () => [...teamKeys.all, 'list'] as const,
  detail: (teamId: string) => [...teamKeys.all, 'detail', teamId] as const,
  members: (teamId: string) => [...teamKeys.detail(teamId), 'members'] as const,
  invitations: (teamId: string) => [...teamKeys.detail(teamId), 'invitations'] as const,
  invitationPreview: (token: string) => [...teamKeys.all, 'invitation-preview', token] as const,
};
