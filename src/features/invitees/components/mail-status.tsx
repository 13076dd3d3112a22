/**
 * The latest invitation or reminder of an invitee: sent, on its way (queued or being sent,
 * with the reason while the mail server cannot take it), or failed with the reason.
 */
import type { Invitee } from '@shared/schemas/invitees';
import { Badge } from '@/components/ui/badge';

const kindWord = { invitation: 'Invitation', reminder: 'Reminder' } as const;
/** A pill broken over two lines reads as two labels: the badge keeps to one line. */
const oneLine = 'whitespace-nowrap';

export function MailStatus({ mail }: { mail: Invitee['mail'] }) {
  if (!mail) return <span className="text-ink-muted">—</span>;
  const kind = kindWord[mail.kind];
  if (mail.status === 'sent') return <Badge className={oneLine}>{kind} sent</Badge>;
  if (mail.status === 'failed')
    return (
      <span className="block">
        <Badge tone="accent" className={oneLine}>
          {kind} failed
        </Badge>
        {mail.reason && <span className="mt-0.5 block text-xs text-ink-soft">{mail.reason}</span>}
      </span>
    );
  return (
    <span className="block">
      <Badge className={oneLine}>{kind} queued</Badge>
      {mail.reason && (
        <span className="mt-0.5 block text-xs text-ink-soft">
          {mail.reason}; retried automatically.
        </span>
      )}
    </span>
  );
}
