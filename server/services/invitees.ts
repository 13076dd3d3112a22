/**
 * Invitations by e-mail: upload a list (preview first, nothing saved while it has errors unless
 * the user imports only the valid rows), send personal links, remind those who have not
 * finished, and honour unsubscribes in every later send.
 */
import { nanoid } from 'nanoid';
import { z } from 'zod';
import type { AppDeps } from '../deps';
import { ConflictError, NotFoundError, ValidationError } from '../lib/errors';
import { loadStudy } from './study-access';
import { readInviteeCsv } from './invitee-csv';
import {
  claimForInvitation,
  claimForReminder,
  deleteInvitee,
  getInviteeByToken,
  insertInvitees,
  listInviteeEmails,
  listInvitees,
  markUnsubscribed,
  type InviteeRecord,
} from '../../db/queries/invitees';
import { fieldworkMail } from '../mail/fieldwork-templates';
import { statedDuration } from '../../shared/mail/invitation-wording';
import { fieldworkSettingsSchema } from '../../shared/schemas/study-lifecycle';
import type { DbOrTx } from '../../db/client';
import type { MailKind } from '../../db/queries/mail-outbox';
import { deliverNow, queueMails } from './mail-delivery';
import type {
  ImportInviteesResult,
  Invitee,
  InviteeCsvPreview,
  InviteeList,
  ListInviteesQuery,
  SendInvitationsInput,
  SendResult,
  UnsubscribeStatus,
} from '../../shared/schemas/invitees';

const PREVIEW_SAMPLE_ROWS = 20;
const PREVIEW_MAX_ERRORS = 200;
/** A second reminder within this window is skipped: protects against double clicks. */
export const REMINDER_MIN_INTERVAL_MS = 60 * 60 * 1000;
const MAIL_CONCURRENCY = 4;

async function readUpload(deps: AppDeps, studyId: string, file: Buffer) {
  const existing = await listInviteeEmails(deps.db, { studyId });
  const result = readInviteeCsv(file, existing);
  const errorRows = new Set(result.errors.map((e) => e.row)).size;
  return { ...result, errorRows };
}

export async function previewInviteeCsv(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  file: Buffer,
): Promise<InviteeCsvPreview> {
  await loadStudy(deps, teamId, studyId);
  const r = await readUpload(deps, studyId, file);
  return {
    totalRows: r.totalRows,
    validCount: r.valid.length,
    errorCount: r.errorRows,
    columns: r.columns,
    sample: r.valid.slice(0, PREVIEW_SAMPLE_ROWS),
    errors: r.errors.slice(0, PREVIEW_MAX_ERRORS),
  };
}

export async function importInviteeCsv(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  file: Buffer,
  opts: { onlyValid: boolean },
): Promise<ImportInviteesResult> {
  await loadStudy(deps, teamId, studyId);
  const r = await readUpload(deps, studyId, file);
  const fileLevel = r.totalRows === 0;
  if (r.errors.length > 0 && (fileLevel || !opts.onlyValid)) {
    throw new ValidationError(
      fileLevel
        ? r.errors[0].message
        : `${r.errorRows} row(s) have errors. Fix the file, or import only the valid rows.`,
      r.errors.slice(0, PREVIEW_MAX_ERRORS).map((e) => ({
        path: `rows.${e.row}${e.column ? `.${e.column}` : ''}`,
        message: e.message,
      })),
      'csv_has_errors',
    );
  }
  const rows = r.valid.map((v) => ({
    email: v.email,
    name: v.name,
    externalId: v.externalId,
    token: nanoid(),
  }));
  const imported = await insertInvitees(deps.db, { studyId, rows });
  return { imported, skipped: r.totalRows - imported };
}

function stateOf(r: {
  invitedAt: Date | null;
  unsubscribedAt: Date | null;
  started: boolean;
  completed: boolean;
}): Invitee['state'] {
  if (r.unsubscribedAt) return 'unsubscribed';
  if (r.completed) return 'completed';
  if (r.started) return 'started';
  return r.invitedAt ? 'invited' : 'not_sent';
}

export async function getInvitees(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  q: ListInviteesQuery,
): Promise<InviteeList> {
  await loadStudy(deps, teamId, studyId);
  const { rows, total } = await listInvitees(deps.db, {
    studyId,
    state: q.state,
    search: q.search || undefined,
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  });
  return {
    items: rows.map((r) => ({
      id: r.id,
      email: r.email,
      name: r.name,
      externalId: r.externalId,
      state: stateOf(r),
      invitedAt: r.invitedAt?.toISOString() ?? null,
      lastRemindedAt: r.lastRemindedAt?.toISOString() ?? null,
      reminderCount: r.reminderCount,
      unsubscribedAt: r.unsubscribedAt?.toISOString() ?? null,
      mail: r.mail,
    })),
    total,
    page: q.page,
    pageSize: q.pageSize,
  };
}

export async function removeInvitee(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  inviteeId: string,
) {
  await loadStudy(deps, teamId, studyId);
  if (!(await deleteInvitee(deps.db, { id: inviteeId, studyId })))
    throw new NotFoundError('Invitee');
}

async function loadLiveStudy(deps: AppDeps, teamId: string, studyId: string) {
  const study = await loadStudy(deps, teamId, studyId);
  if (study.status !== 'live')
    throw new ConflictError(
      'study_not_live',
      'Invitations and reminders can only be sent while the study is live.',
    );
  return study;
}

/** Only the consent page's text is read here, so a loose shape is enough. */
const consentBodySchema = z.object({
  pages: z.array(z.looseObject({ kind: z.string(), body: z.string().optional() })),
});

type MailScope = {
  teamId: string;
  studyId: string;
  publicId: string;
  studyTitle: string;
  duration: string | null;
  senderName: string | null;
  replyTo: string | null;
};

/** What every e-mail of a study shares: its public title, stated duration and sender. */
function mailScope(
  study: Awaited<ReturnType<typeof loadLiveStudy>>,
  teamId: string,
  input: SendInvitationsInput,
): MailScope {
  const pages = consentBodySchema.safeParse(study.questionnaire);
  const consent = pages.success ? pages.data.pages.find((p) => p.kind === 'consent') : undefined;
  const duration = statedDuration(consent?.body ?? '');
  if (duration === null)
    for (const field of ['subject', 'message'] as const)
      if (input[field]?.includes('{duration}'))
        throw new ValidationError(
          'The consent page does not say how long the survey takes, so {duration} would be empty. Say it there (e.g. "about 10 minutes"), or take {duration} out.',
          [{ path: field, message: 'The consent page states no duration for {duration}' }],
        );
  const settings = fieldworkSettingsSchema.parse(study.settings ?? {});
  return {
    teamId,
    studyId: study.id,
    publicId: study.publicId,
    studyTitle: study.publicTitle || study.name,
    duration,
    senderName: settings.mailSenderName,
    replyTo: settings.mailReplyTo,
  };
}

function linksFor(deps: AppDeps, publicId: string, token: string) {
  const base = deps.env.APP_URL;
  const t = encodeURIComponent(token);
  return {
    surveyLink: `${base}/s/${encodeURIComponent(publicId)}?inv=${t}`,
    unsubscribeLink: `${base}/unsubscribe/${t}`,
    unsubscribeApi: `${base}/api/unsubscribe/${t}`,
  };
}

/**
 * Claims invitees and writes their mails to the outbox in one transaction (mail-delivery.ts),
 * then tries to deliver them at once; what the mail server cannot take now is retried by the
 * mail job, never lost.
 */
async function claimAndMail(
  deps: AppDeps,
  scope: MailScope,
  kind: MailKind,
  input: SendInvitationsInput,
  claim: (tx: DbOrTx) => Promise<InviteeRecord[]>,
): Promise<SendResult> {
  const { claimed, ids } = await deps.db.transaction(async (tx) => {
    const claimed = await claim(tx);
    const ids = await queueMails(
      tx,
      deps.jobs,
      scope,
      claimed.map((r) => ({
        inviteeId: r.id,
        kind,
        mail: fieldworkMail({
          kind,
          to: r.email,
          name: r.name,
          studyTitle: scope.studyTitle,
          duration: scope.duration,
          senderName: scope.senderName,
          replyTo: scope.replyTo,
          ...linksFor(deps, scope.publicId, r.token),
          subject: input.subject,
          message: input.message,
        }),
      })),
    );
    return { claimed, ids };
  });
  const outcome = await deliverNow(deps, ids, MAIL_CONCURRENCY);
  const asked = input.inviteeIds?.length ?? claimed.length;
  return {
    sent: outcome.sent,
    // "skipped" here means another process took the row first: it is on its way.
    queued: outcome.retrying + outcome.skipped,
    failed: outcome.failed,
    skipped: Math.max(0, asked - claimed.length),
  };
}

type SendArgs = [deps: AppDeps, teamId: string, studyId: string, input: SendInvitationsInput];

/** Invitations to those not yet invited, or reminders to those invited but not finished. */
async function sendToInvitees(
  deps: AppDeps,
  teamId: string,
  studyId: string,
  input: SendInvitationsInput,
  kind: 'invitation' | 'reminder',
): Promise<SendResult> {
  const study = await loadLiveStudy(deps, teamId, studyId);
  const scope = mailScope(study, teamId, input);
  const now = new Date();
  const ids = input.inviteeIds;
  return claimAndMail(deps, scope, kind, input, (tx) =>
    kind === 'invitation'
      ? claimForInvitation(tx, { studyId, ids, now })
      : claimForReminder(tx, {
          studyId,
          ids,
          now,
          notSince: new Date(now.getTime() - REMINDER_MIN_INTERVAL_MS),
        }),
  );
}

export const sendInvitations = (...args: SendArgs) => sendToInvitees(...args, 'invitation');
export const sendReminders = (...args: SendArgs) => sendToInvitees(...args, 'reminder');

export function maskEmail(email: string): string {
  const at = email.lastIndexOf('@');
  if (at < 1) return '***';
  return `${email[0]}***${email.slice(at)}`;
}

export async function getUnsubscribeStatus(
  deps: AppDeps,
  token: string,
): Promise<UnsubscribeStatus> {
  const inv = await getInviteeByToken(deps.db, { token });
  if (!inv) throw new NotFoundError('Link');
  return {
    studyName: inv.studyName,
    maskedEmail: maskEmail(inv.email),
    unsubscribed: inv.unsubscribedAt !== null,
  };
}

/** Idempotent: a second click keeps the first date. */
export async function unsubscribeInvitee(deps: AppDeps, token: string): Promise<UnsubscribeStatus> {
  const inv = await getInviteeByToken(deps.db, { token });
  if (!inv) throw new NotFoundError('Link');
  await markUnsubscribed(deps.db, { id: inv.id, now: new Date() });
  return { studyName: inv.studyName, maskedEmail: maskEmail(inv.email), unsubscribed: true };
}
