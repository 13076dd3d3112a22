/**
 * Erasure of one respondent on a data-protection request (owners only, 'respondents:erase'):
 * the respondent is found by number, invitee e-mail address or external id; a preview says
 * what will go, and the erasure itself needs a reason. The lookup value never reaches the
 * audit trail.
 */
import { z } from 'zod';
import { addIssue } from './add-issue';

export const erasureLookupKinds = ['number', 'email', 'externalId'] as const;
export type ErasureLookupKind = (typeof erasureLookupKinds)[number];

export const erasureLookupLabels: Record<ErasureLookupKind, string> = {
  number: 'Respondent number',
  email: 'Invitee e-mail address',
  externalId: 'External id',
};

export const erasureLookupSchema = z
  .object({
    by: z.enum(erasureLookupKinds, { error: 'Choose how to find the respondent' }),
    value: z
      .string({ error: 'Enter the respondent number, e-mail address or external id' })
      .trim()
      .min(1, 'Enter the respondent number, e-mail address or external id')
      .max(320, 'At most 320 characters'),
  })
  .superRefine((v, ctx) => {
    if (v.by === 'number' && !/^[1-9]\d{0,8}$/.test(v.value))
      addIssue(ctx, ['value'], 'Enter a whole number from 1');
  });
export type ErasureLookup = z.infer<typeof erasureLookupSchema>;

export const eraseRespondentSchema = z
  .object({
    by: z.enum(erasureLookupKinds, { error: 'Choose how to find the respondent' }),
    value: z.string().trim().min(1).max(320),
    reason: z
      .string({ error: 'Give the reason for the erasure' })
      .trim()
      .min(5, 'Give the reason for the erasure (at least 5 characters), e.g. a request reference')
      .max(500, 'At most 500 characters'),
  })
  .superRefine((v, ctx) => {
    const lookup = erasureLookupSchema.safeParse(v);
    if (!lookup.success)
      for (const issue of lookup.error.issues) addIssue(ctx, issue.path, issue.message);
  });
export type EraseRespondentInput = z.infer<typeof eraseRespondentSchema>;

/** What an erasure would remove (the preview), without showing the personal data itself. */
export type ErasurePreview = {
  /** Null when only an invitation exists (the person never opened the link). */
  number: number | null;
  /** Start of the respondent's random id, as the respondent table shows it. */
  reference: string | null;
  status: 'in_progress' | 'completed' | 'screened_out' | 'over_quota' | null;
  answers: number;
  revisions: number;
  invitation: boolean;
  /** Finished or running runs that may have used this respondent's answers. */
  runsAffected: number;
};

export type ErasureResult = ErasurePreview & { erasedAt: string };
