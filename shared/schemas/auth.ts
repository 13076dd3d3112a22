import { z } from 'zod';
import { roleSchema } from '../permissions';
import { emailSchema } from './email';

export const passwordSchema = z
  .string()
  .min(10, 'Use at least 10 characters')
  .max(200, 'Use at most 200 characters');

/** A path inside the app to return to after a link (never another site). */
export const localPathSchema = z
  .string()
  .max(500)
  .regex(/^\/(?![/\\])[^\s]*$/, 'Use a path inside the app');

export const signUpSchema = z.object({
  name: z.string().trim().min(1, 'Enter your name').max(120),
  email: emailSchema,
  password: passwordSchema,
  teamName: z.string().trim().min(1, 'Name your team').max(120),
  /** Where the confirmation link leads after signing in (e.g. back to an invitation). */
  redirectTo: localPathSchema.optional(),
});
export type SignUpInput = z.infer<typeof signUpSchema>;

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, 'Enter your password').max(200),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const forgotPasswordSchema = z.object({ email: emailSchema });

/** The same answer whether or not the address has an account. */
export const acceptedMessageSchema = z.object({ message: z.string() });
export type AcceptedMessage = z.infer<typeof acceptedMessageSchema>;

export const confirmEmailSchema = z.object({
  token: z.string().min(20, 'This confirmation link is incomplete').max(200),
});
export type ConfirmEmailInput = z.infer<typeof confirmEmailSchema>;
export type ForgotPasswordInput = z.infer<typeof forgotPasswordSchema>;

export const resetPasswordSchema = z.object({
  token: z.string().min(20, 'This reset link is incomplete').max(200),
  password: passwordSchema,
});
export type ResetPasswordInput = z.infer<typeof resetPasswordSchema>;

export const updateAccountSchema = z
  .object({
    name: z.string().trim().min(1, 'Enter your name').max(120).optional(),
    currentPassword: z.string().max(200).optional(),
    newPassword: passwordSchema.optional(),
  })
  .refine((v) => !v.newPassword || !!v.currentPassword, {
    path: ['currentPassword'],
    message: 'Enter your current password to set a new one',
  });
export type UpdateAccountInput = z.infer<typeof updateAccountSchema>;

export const teamSummarySchema = z.object({ id: z.uuid(), name: z.string(), role: roleSchema });
export type TeamSummary = z.infer<typeof teamSummarySchema>;

export const currentUserSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  teams: z.array(teamSummarySchema),
});
export type CurrentUser = z.infer<typeof currentUserSchema>;

/** One open sign-in session of the current user (account page). */
export const accountSessionSchema = z.object({
  id: z.uuid(),
  device: z.string(),
  createdAt: z.string(),
  lastSeenAt: z.string(),
  expiresAt: z.string(),
  current: z.boolean(),
});
export type AccountSession = z.infer<typeof accountSessionSchema>;

export const sessionParamsSchema = z.object({ sessionId: z.uuid('Unknown session') });
