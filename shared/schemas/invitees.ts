/**
 * Invitees of a study: people invited by e-mail with a personal link. A CSV upload is first
 * previewed (row-level errors, nothing saved), then imported — all rows, or only the valid ones
 * when the user says so.
 */
import { z } from 'zod';
import { knownPlaceholdersOnly } from '../mail/invitation-wording';
import { emailSchema } from './email';

export const INVITEE_NAME_MAX = 120;
export const INVITEE_EXTERNAL_ID_MAX = 100;
/** Upload limits: enough for a large panel list, small enough to parse in one request. */
export const INVITEE_CSV_MAX_BYTES = 5 * 1024 * 1024;
export const INVITEE_CSV_MAX_ROWS = 50_000;

/** One invitee row after normalisation (e-mail trimmed and lower-cased). */
export const inviteeRowSchema = z.object({
  email: emailSchema,
  name: z
    .string()
    .trim()
    .max(INVITEE_NAME_MAX, `Use at most ${INVITEE_NAME_MAX} characters`)
    .default(''),
  externalId: z
    .string()
    .trim()
    .max(INVITEE_EXTERNAL_ID_MAX, `Use at most ${INVITEE_EXTERNAL_ID_MAX} characters`)
    .regex(/^[^\s<>"'`]*$/, 'No spaces, quotes or angle brackets')
    .transform((v) => (v === '' ? null : v))
    .nullable()
    .default(null),
});
export type InviteeRow = z.infer<typeof inviteeRowSchema>;

/** A problem in the uploaded file: row is the line in the file (header = 1), column its name. */
export const csvIssueSchema = z.object({
  row: z.number().int().min(1),
  column: z.string().nullable(),
  message: z.string(),
});
export type CsvIssue = z.infer<typeof csvIssueSchema>;

export const inviteeCsvPreviewSchema = z.object({
  totalRows: z.number().int(),
  validCount: z.number().int(),
  errorCount: z.number().int(),
  /** Columns found, mapped to their meaning; unknown ones are ignored. */
  columns: z.array(z.object({ header: z.string(), field: z.string().nullable() })),
  /** The first valid rows, for the user to check the mapping. */
  sample: z.array(inviteeRowSchema.extend({ row: z.number().int() })),
  /** Row-level problems (capped; errorCount says how many there are in all). */
  errors: z.array(csvIssueSchema),
});
export type InviteeCsvPreview = z.infer<typeof inviteeCsvPreviewSchema>;

/** Multipart text field next to the file: import only the valid rows when the file has errors. */
export const importInviteesFieldsSchema = z.object({
  onlyValid: z
    .enum(['true', 'false'], 'onlyValid must be true or false')
    .default('false')
    .transform((v) => v === 'true'),
});

export const importInviteesResultSchema = z.object({
  imported: z.number().int(),
  skipped: z.number().int(),
});
export type ImportInviteesResult = z.infer<typeof importInviteesResultSchema>;

export const inviteeStateSchema = z.enum([
  'not_sent',
  'invited',
  'started',
  'completed',
  'unsubscribed',
]);
export type InviteeState = z.infer<typeof inviteeStateSchema>;

export const inviteeSchema = z.object({
  id: z.uuid(),
  email: z.string(),
  name: z.string(),
  externalId: z.string().nullable(),
  state: inviteeStateSchema,
  invitedAt: z.string().nullable(),
  lastRemindedAt: z.string().nullable(),
  reminderCount: z.number().int(),
  unsubscribedAt: z.string().nullable(),
  /** The latest invitation or reminder: queued (waiting or retrying), sending, sent or failed. */
  mail: z
    .object({
      kind: z.enum(['invitation', 'reminder']),
      status: z.enum(['queued', 'sending', 'sent', 'failed']),
      /** Why the last attempt failed (kept while it is retried). */
      reason: z.string().nullable(),
    })
    .nullable(),
});
export type Invitee = z.infer<typeof inviteeSchema>;

export const listInviteesQuerySchema = z.object({
  state: inviteeStateSchema.optional(),
  search: z.string().trim().max(200).optional(),
  page: z.coerce.number().int().min(1).max(100_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
});
export type ListInviteesQuery = z.infer<typeof listInviteesQuerySchema>;

export const inviteeListSchema = z.object({
  items: z.array(inviteeSchema),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type InviteeList = z.infer<typeof inviteeListSchema>;

/**
 * Optional wording of the e-mail, with {name}, {study} and {duration} placeholders; the
 * personal and unsubscribe links are always added.
 */
export const mailSubjectSchema = z
  .string()
  .trim()
  .min(1, 'Enter a subject')
  .max(150, 'Use at most 150 characters')
  .superRefine(knownPlaceholdersOnly);
export const mailMessageSchema = z
  .string()
  .trim()
  .min(1, 'Enter a message')
  .max(4000, 'Use at most 4000 characters')
  .superRefine(knownPlaceholdersOnly);
export const mailWordingSchema = z.object({
  subject: mailSubjectSchema.optional(),
  message: mailMessageSchema.optional(),
});
const mailWording = mailWordingSchema.shape;

/** Without inviteeIds: everybody who qualifies (not yet invited / not finished). */
export const sendInvitationsSchema = z.object({
  inviteeIds: z.array(z.uuid()).min(1).max(10_000).optional(),
  ...mailWording,
});
export type SendInvitationsInput = z.infer<typeof sendInvitationsSchema>;

export const sendRemindersSchema = sendInvitationsSchema;
export type SendRemindersInput = SendInvitationsInput;

export const sendResultSchema = z.object({
  sent: z.number().int(),
  /** Not delivered yet: the mail server could not take them; they are retried automatically. */
  queued: z.number().int(),
  /** Refused by the mail server; the reason is on the invitee. */
  failed: z.number().int(),
  /** Asked for but not eligible (already invited, finished, unsubscribed, reminded recently). */
  skipped: z.number().int(),
});
export type SendResult = z.infer<typeof sendResultSchema>;

export const inviteeParamsSchema = z.object({
  teamId: z.uuid(),
  studyId: z.uuid(),
  inviteeId: z.uuid('Unknown invitee'),
});

/** Public unsubscribe page: the token from the personal link. */
export const unsubscribeParamsSchema = z.object({
  token: z
    .string()
    .min(10)
    .max(64)
    .regex(/^[A-Za-z0-9_-]+$/, 'Unknown link'),
});
export const unsubscribeStatusSchema = z.object({
  studyName: z.string(),
  /** Masked so a forwarded link does not reveal the full address. */
  maskedEmail: z.string(),
  unsubscribed: z.boolean(),
});
export type UnsubscribeStatus = z.infer<typeof unsubscribeStatusSchema>;
