/**
 * The Fieldwork section's figures: sample flow (starts, completes, screen-outs, over-quota),
 * where unfinished respondents stopped, timing, completes per block and per version, and the
 * invitations summary. Aggregates only: no personal data, so every role may read them.
 */
import { z } from 'zod';

export const dropOffStepSchema = z.object({
  /** Screen key, or "tasks#k" for the k-th choice task in the order each respondent saw them. */
  key: z.string(),
  label: z.string(),
  /** Respondents with an answer on this screen. */
  reached: z.number().int(),
  /** Unfinished respondents whose next screen is this one (left here, or still answering). */
  stoppedHere: z.number().int(),
});
export type DropOffStep = z.infer<typeof dropOffStepSchema>;

/** Completes per cell of one screening question's segment quotas, against the targets. */
export const quotaProgressSchema = z.object({
  question: z.string(),
  cells: z.array(
    z.object({
      id: z.string(),
      label: z.string(),
      target: z.number().int(),
      completed: z.number().int(),
    }),
  ),
});
export type QuotaProgress = z.infer<typeof quotaProgressSchema>;

export const fieldworkStatsSchema = z.object({
  status: z.enum(['draft', 'live', 'closed']),
  currentVersion: z.number().int(),
  generatedAt: z.string(),
  counts: z.object({
    starts: z.number().int(),
    inProgress: z.number().int(),
    completed: z.number().int(),
    screenedOut: z.number().int(),
    overQuota: z.number().int(),
  }),
  /** Completes / (starts − screen-outs − over-quota); null before anyone qualified. */
  completionRate: z.number().nullable(),
  /** Median total time of completed respondents. */
  medianDurationMs: z.number().nullable(),
  byBlock: z.array(
    z.object({ block: z.number().int(), starts: z.number().int(), completed: z.number().int() }),
  ),
  byVersion: z.array(
    z.object({ version: z.number().int(), starts: z.number().int(), completed: z.number().int() }),
  ),
  dropOff: z.array(dropOffStepSchema),
  /** Segment quotas of the latest version's screening questions (empty when none). */
  quotas: z.array(quotaProgressSchema),
  /** Starts and completes per calendar day (UTC). */
  daily: z.array(
    z.object({ date: z.string(), starts: z.number().int(), completed: z.number().int() }),
  ),
  invitations: z.object({
    total: z.number().int(),
    sent: z.number().int(),
    reminded: z.number().int(),
    unsubscribed: z.number().int(),
    started: z.number().int(),
    completed: z.number().int(),
  }),
});
export type FieldworkStats = z.infer<typeof fieldworkStatsSchema>;
