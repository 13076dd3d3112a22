import { z } from 'zod';
import { roleSchema } from '../permissions';
import { emailSchema } from './email';

export const teamIdParamsSchema = z.object({ teamId: z.uuid() });

export const createTeamSchema = z.object({
  name: z.string().trim().min(1, 'Name the team').max(120),
});
export type CreateTeamInput = z.infer<typeof createTeamSchema>;

export const renameTeamSchema = createTeamSchema;

export const memberSchema = z.object({
  userId: z.uuid(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  joinedAt: z.string(),
});
export type Member = z.infer<typeof memberSchema>;

export const memberParamsSchema = z.object({ teamId: z.uuid(), userId: z.uuid('Unknown member') });
export const changeRoleSchema = z.object({ role: roleSchema });
export type ChangeRoleInput = z.infer<typeof changeRoleSchema>;

export const createInvitationSchema = z.object({ email: emailSchema, role: roleSchema });
export type CreateInvitationInput = z.infer<typeof createInvitationSchema>;

export const invitationSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  role: roleSchema,
  expiresAt: z.string(),
  createdAt: z.string(),
});
export type Invitation = z.infer<typeof invitationSchema>;

export const invitationParamsSchema = z.object({
  teamId: z.uuid(),
  invitationId: z.uuid('Unknown invitation'),
});
export const invitationTokenParamsSchema = z.object({ token: z.string().min(20).max(200) });

/** What an invitee sees before accepting. */
export const invitationPreviewSchema = z.object({
  teamName: z.string(),
  email: z.string(),
  role: roleSchema,
  invitedBy: z.string().nullable(),
  expiresAt: z.string(),
});
export type InvitationPreview = z.infer<typeof invitationPreviewSchema>;
