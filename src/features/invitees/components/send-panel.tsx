/**
 * Send personal links to everybody not yet invited, or remind those who have not finished.
 * The wording can be changed, with placeholders, and is previewed as an invitee will read it
 * (shared/mail/invitation-wording.ts, the server's own wording code); the personal link and
 * the unsubscribe link are always added. Each send asks first, naming how many people it
 * reaches.
 */
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/feedback';
import { ErrorText } from '@/components/ui/error-boundary';
import { TextAreaField, TextField } from '@/components/ui/field';
import { useConfirm } from '@/components/ui/confirm-dialog';
import { emptyOr } from '@shared/schemas/empty-or';
import { mailMessageSchema, mailSubjectSchema, type SendResult } from '@shared/schemas/invitees';
import { MailPreview } from './mail-preview';
import { useSendInvitations, useSendReminders } from '../api/send-mail';
import { formField } from '@/components/ui/form-field';

const wordingSchema = z.object({
  subject: emptyOr(mailSubjectSchema),
  message: emptyOr(mailMessageSchema),
});
type Wording = z.infer<typeof wordingSchema>;

const orUndefined = (s: string) => (s.trim() === '' ? undefined : s.trim());

/** What a send did, in words that stay true for an empty list. */
export function describeSend(kind: 'invitations' | 'reminders', r: SendResult): string {
  const noun = kind === 'invitations' ? 'invitation' : 'reminder';
  const parts = [`${r.sent} ${noun}${r.sent === 1 ? '' : 's'} sent`];
  if (r.queued > 0)
    parts.push(
      `${r.queued} waiting for the mail server, which could not take them yet; they are retried automatically`,
    );
  if (r.failed > 0) parts.push(`${r.failed} refused by the mail server (the list shows why)`);
  if (r.sent === 0 && r.queued === 0 && r.failed === 0)
    parts.push(
      kind === 'invitations'
        ? 'everybody on the list had been invited already'
        : 'nobody is due a reminder (finished, unsubscribed or reminded within the hour)',
    );
  return `${parts.join('; ')}.`;
}

const people = (n: number) => `${n} ${n === 1 ? 'person' : 'people'}`;

export function SendPanel({
  teamId,
  studyId,
  live,
  listSize,
  notInvited,
  notFinished,
  studyTitle,
  duration,
  onSent,
}: {
  teamId: string;
  studyId: string;
  live: boolean;
  /** People on the list; with nobody on it there is nothing to send. */
  listSize: number;
  /** On the list and not yet invited: who "Send invitations" reaches. */
  notInvited: number;
  /** Invited, not finished and not unsubscribed: the most "Send reminders" reaches. */
  notFinished: number;
  /** The title respondents see, and the duration the consent page states (or null). */
  studyTitle: string;
  duration: string | null;
  onSent?: () => void;
}) {
  const invite = useSendInvitations(teamId, studyId);
  const remind = useSendReminders(teamId, studyId);
  const [last, setLast] = useState<string | null>(null);
  const { confirm, dialog } = useConfirm();
  const form = useForm<Wording>({
    resolver: zodResolver(wordingSchema),
    defaultValues: { subject: '', message: '' },
  });
  const submit = (kind: 'invitations' | 'reminders') =>
    form.handleSubmit(async (w) => {
      const input = { subject: orUndefined(w.subject), message: orUndefined(w.message) };
      const m = kind === 'invitations' ? invite : remind;
      const ok = await confirm(
        kind === 'invitations'
          ? {
              title: `Send invitations to ${people(notInvited)}?`,
              body: 'Everyone on the list who has not been invited yet gets an e-mail with their personal link. This cannot be undone.',
              confirmLabel: `Send ${notInvited} invitation${notInvited === 1 ? '' : 's'}`,
            }
          : {
              title: `Send reminders to up to ${people(notFinished)}?`,
              body: 'Invited people who have not finished and have not unsubscribed get a reminder, except anyone reminded within the last hour.',
              confirmLabel: 'Send reminders',
            },
      );
      if (!ok) return;
      setLast(null);
      m.mutate(input, {
        onSuccess: (r) => {
          setLast(describeSend(kind, r));
          onSent?.();
        },
      });
    });
  const wording = form.watch();

  return (
    <form className="space-y-4" onSubmit={(e) => e.preventDefault()} noValidate>
      {listSize === 0 && (
        <p className="text-sm text-ink-soft">
          Nobody is on the list yet. Add people first; nothing is sent until you press Send.
        </p>
      )}
      {!live && (
        <Alert tone="info">
          E-mails can be sent while the study is live, so that the links work when people open them.
        </Alert>
      )}
      <details className="rounded-md border border-line px-3 py-2">
        <summary className="cursor-pointer text-sm font-medium text-ink">
          Change the wording
        </summary>
        <div className="mt-3 space-y-3">
          <TextField
            label="Subject"
            placeholder="Invitation: <study name>"
            {...formField(form, 'subject')}
          />
          <TextAreaField
            label="Message"
            hint="Placeholders: {name} (the invitee's name), {study} (the title respondents see), {duration} (as the consent page states it). The personal link and the unsubscribe link are added below your message."
            {...formField(form, 'message')}
          />
          <MailPreview
            studyTitle={studyTitle}
            duration={duration}
            subject={orUndefined(wording.subject ?? '')}
            message={orUndefined(wording.message ?? '')}
          />
        </div>
      </details>
      <div className="flex flex-wrap gap-2">
        <Button
          disabled={!live || notInvited === 0}
          busy={invite.isPending}
          onClick={submit('invitations')}
        >
          Send invitations
        </Button>
        <Button
          variant="secondary"
          disabled={!live || notFinished === 0}
          busy={remind.isPending}
          onClick={submit('reminders')}
        >
          Send reminders
        </Button>
      </div>
      <p className="text-xs text-ink-muted">
        Invitations go to everyone on the list not yet invited. Reminders go to those invited who
        have not finished, at most once an hour. Unsubscribed people never get another e-mail.
      </p>
      <ErrorText error={invite.error ?? remind.error} />
      {dialog}
      {last && <Alert tone="success">{last}</Alert>}
    </form>
  );
}
