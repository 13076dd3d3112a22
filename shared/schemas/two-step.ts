/**
 * Two-step sign-in: a time-based one-time password from an authenticator app (RFC 6238), with
 * one-time recovery codes for a lost phone.
 */
import { z } from 'zod';
import { currentUserSchema } from './auth';

/** A six-digit code from the app, or one of the recovery codes (dashes and spaces ignored). */
export const secondStepCodeSchema = z
  .string()
  .trim()
  .min(6, 'Enter the 6-digit code from your app, or a recovery code')
  .max(24, 'Enter the 6-digit code from your app, or a recovery code');

export const secondStepSchema = z.object({ code: secondStepCodeSchema });
export type SecondStepInput = z.infer<typeof secondStepSchema>;

/** Turning two-step sign-in on proves the app holds the secret: a code from the app only. */
export const enableTwoStepSchema = z.object({
  code: z
    .string()
    .trim()
    .regex(/^\d{6}$/, 'Enter the 6-digit code your app shows'),
});
export type EnableTwoStepInput = z.infer<typeof enableTwoStepSchema>;

export const disableTwoStepSchema = z.object({
  password: z.string().min(1, 'Enter your password').max(200),
  code: secondStepCodeSchema,
});
export type DisableTwoStepInput = z.infer<typeof disableTwoStepSchema>;

export const twoStepStatusSchema = z.object({
  enabled: z.boolean(),
  enabledAt: z.string().nullable(),
  recoveryCodesLeft: z.number().int(),
});
export type TwoStepStatus = z.infer<typeof twoStepStatusSchema>;

export const twoStepSetupSchema = z.object({
  /** Base32, for typing into an app that cannot scan. */
  secret: z.string(),
  /** The otpauth:// URI the QR code carries (Key Uri Format). */
  uri: z.string(),
});
export type TwoStepSetup = z.infer<typeof twoStepSetupSchema>;

export const recoveryCodesSchema = z.object({ recoveryCodes: z.array(z.string()) });
export type RecoveryCodes = z.infer<typeof recoveryCodesSchema>;

/** Sign-in answers with the user, or asks for the second step (the password was right). */
export const signInResultSchema = z.union([
  currentUserSchema,
  z.object({ twoStepRequired: z.literal(true) }),
]);
export type SignInResult = z.infer<typeof signInResultSchema>;
