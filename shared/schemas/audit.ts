/**
 * The audit trail as the API shows it to owners. Actions are dotted names, grouped by their
 * first part (auth, member, study, respondent, run, export) for filtering.
 */
import { z } from 'zod';

export const auditActions = [
  'auth.sign_in',
  'auth.sign_in_failed',
  'auth.email_confirmed',
  'auth.password_changed',
  'auth.password_reset',
  'auth.sessions_revoked',
  'auth.second_step_failed',
  'auth.two_step_enabled',
  'auth.two_step_disabled',
  'auth.recovery_codes_renewed',
  'member.joined',
  'member.role_changed',
  'member.removed',
  'invitation.created',
  'invitation.cancelled',
  'study.went_live',
  'study.closed',
  'study.reopened',
  'study.returned_to_draft',
  'study.design_adopted',
  'study.imported',
  'study.languages_changed',
  'study.translations_saved',
  'study.translations_imported',
  'study.translations_confirmed',
  'respondent.excluded',
  'respondent.included',
  'respondent.flagged_excluded',
  'respondent.erased',
  'run.started',
  'run.cancelled',
  'export.personal_data',
  'audit.downloaded',
] as const;
export const auditActionSchema = z.enum(auditActions);
export type AuditAction = z.infer<typeof auditActionSchema>;

export const auditGroups = [
  'auth',
  'member',
  'invitation',
  'study',
  'respondent',
  'run',
  'export',
  'audit',
] as const;

export const listAuditQuerySchema = z.object({
  /** One action, or a group such as "study" for every study.* action. */
  action: z.union([auditActionSchema, z.enum(auditGroups)]).optional(),
  actorId: z.uuid().optional(),
  studyId: z.uuid().optional(),
  from: z.iso.datetime({ offset: true }).optional(),
  to: z.iso.datetime({ offset: true }).optional(),
  /** Rows older than this id (the next page of a newest-first list). */
  before: z.coerce.number().int().min(1).optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});
export type ListAuditQuery = z.infer<typeof listAuditQuerySchema>;

export const auditEventSchema = z.object({
  id: z.number().int(),
  at: z.string(),
  action: z.string(),
  actorId: z.string().nullable(),
  actorEmail: z.string().nullable(),
  studyId: z.string().nullable(),
  targetType: z.string().nullable(),
  targetId: z.string().nullable(),
  details: z.record(z.string(), z.unknown()),
});
export type AuditEvent = z.infer<typeof auditEventSchema>;

export const auditPageSchema = z.object({
  events: z.array(auditEventSchema),
  /** Pass as `before` for the next (older) page; null at the end. */
  nextBefore: z.number().int().nullable(),
});
export type AuditPage = z.infer<typeof auditPageSchema>;
