/**
 * Fieldwork settings (studies.settings) and the study lifecycle: go-live readiness, versions,
 * close and reopen. Settings are shared with other features (quality thresholds), so the
 * schema keeps keys it does not know.
 */
import { z } from 'zod';
import { emailSchema } from './email';

/** Hours after a close during which answers given before it are still accepted (up to 30 days). */
const lateAnswerGraceHours = z.number().int().min(0).max(720);

const redirectUrl = z
  .string()
  .trim()
  .max(1000)
  .refine((s) => /^https?:\/\//i.test(s), 'Use an http:// or https:// address')
  .nullable();

/** The name invitation e-mails come from (the settings form checks the same rule). */
export const mailSenderNameSchema = z
  .string()
  .trim()
  .min(1, 'Enter a name, or leave it empty')
  .max(80, 'Use at most 80 characters')
  .regex(/^[^<>"\r\n]*$/, 'No angle brackets, quotes or line breaks');
const mailReplyTo = emailSchema;
/** The panel pass-through parameter's name in a link (the settings form checks the same rule). */
export const panelParamSchema = z
  .string()
  .regex(/^[A-Za-z][A-Za-z0-9_]{0,29}$/, 'Letters, digits and _, starting with a letter');

export const closedReasonSchema = z.enum(['manual', 'date', 'quota']);
export type ClosedReason = z.infer<typeof closedReasonSchema>;

export const fieldworkSettingsSchema = z.looseObject({
  /** Close automatically at this time (ISO 8601). */
  closeAt: z.iso.datetime({ offset: true }).nullable().default(null),
  /** Close automatically when this many respondents have completed. */
  quotaCompletes: z.number().int().min(1).max(1_000_000).nullable().default(null),
  /** Name of the panel pass-through parameter in the link, stored as the respondent's external id. */
  panelParam: panelParamSchema.default('pid'),
  /** Where respondents go when they finish; {pid} is replaced by their external id. */
  redirects: z
    .object({
      complete: redirectUrl.default(null),
      screenedOut: redirectUrl.default(null),
      overQuota: redirectUrl.default(null),
    })
    .default({ complete: null, screenedOut: null, overQuota: null }),
  /**
   * Answers given before the close (offline, or stuck in a phone's outbox) are still accepted
   * this many hours after it, from sessions that started while the study was live.
   */
  lateAnswerGraceHours: lateAnswerGraceHours.default(24),
  /** A returning panel id resumes its own session instead of starting a second respondent. */
  dedupePanelIds: z.boolean().default(true),
  /** Invitation e-mails: the name they come from, and where replies go. */
  mailSenderName: mailSenderNameSchema.nullable().default(null),
  mailReplyTo: mailReplyTo.nullable().default(null),
  closedReason: closedReasonSchema.nullable().default(null),
  closedAt: z.string().nullable().default(null),
});
export type FieldworkSettings = z.infer<typeof fieldworkSettingsSchema>;

export const updateFieldworkSettingsSchema = z
  .object({
    closeAt: z.iso.datetime({ offset: true }).nullable(),
    quotaCompletes: z.number().int().min(1).max(1_000_000).nullable(),
    panelParam: z
      .string()
      .regex(/^[A-Za-z][A-Za-z0-9_]{0,29}$/, 'Letters, digits and _, starting with a letter'),
    redirects: z.object({
      complete: redirectUrl,
      screenedOut: redirectUrl,
      overQuota: redirectUrl,
    }),
    lateAnswerGraceHours,
    dedupePanelIds: z.boolean(),
    mailSenderName: mailSenderNameSchema.nullable(),
    mailReplyTo: mailReplyTo.nullable(),
  })
  .partial()
  .refine((v) => v.panelParam !== 'inv', {
    message: '"inv" is taken by personal links',
    path: ['panelParam'],
  });
export type UpdateFieldworkSettingsInput = z.input<typeof updateFieldworkSettingsSchema>;

export const readinessProblemSchema = z.object({
  code: z.string(),
  /** Which part of the study the problem is in, e.g. "design", "questionnaire.pages.2". */
  path: z.string(),
  message: z.string(),
});
export type ReadinessProblem = z.infer<typeof readinessProblemSchema>;

/**
 * Problems refuse going live; warnings do not (translations made from a source wording that
 * has changed since, for instance) but are worth a look first.
 */
export type Readiness = {
  ready: boolean;
  problems: ReadinessProblem[];
  warnings: ReadinessProblem[];
};

export type StudyVersionSummary = {
  version: number;
  createdAt: string;
  respondents: number;
  completes: number;
};

/** What the lifecycle endpoints answer with. */
export type StudyLifecycle = {
  status: 'draft' | 'live' | 'closed';
  publicId: string;
  currentVersion: number;
  settings: FieldworkSettings;
  completes: number;
};

export type LifecycleAction = 'go-live' | 'close' | 'reopen' | 'return-to-draft';
