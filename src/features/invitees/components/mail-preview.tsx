/**
 * The invitation as an invitee reads it, built by the same wording code the server sends
 * with (shared/mail/invitation-wording.ts), for an example name.
 */
import { composeMailWording, unknownPlaceholders } from '@shared/mail/invitation-wording';

export function MailPreview({
  studyTitle,
  duration,
  subject,
  message,
}: {
  studyTitle: string;
  duration: string | null;
  subject?: string;
  message?: string;
}) {
  // While a placeholder is misspelt the field shows the error; the preview waits for a fix.
  const broken = [subject ?? '', message ?? ''].some((t) => unknownPlaceholders(t).length > 0);
  const w = composeMailWording({
    kind: 'invitation',
    name: 'Ana Ferreira',
    study: studyTitle,
    duration,
    subject,
    message,
  });
  return (
    <section aria-label="Preview of the invitation" className="rounded-md bg-canvas p-3 text-sm">
      <p className="text-xs text-ink-muted">Preview for an invitee named Ana Ferreira</p>
      {broken ? (
        <p className="mt-2 text-ink-soft">Fix the placeholders above to see the preview.</p>
      ) : (
        <div className="mt-2 space-y-2 break-words text-ink">
          <p className="font-semibold">{w.subject}</p>
          <p>{w.greeting}</p>
          {w.message.split(/\n\s*\n/).map((para, i) => (
            <p key={i} className="whitespace-pre-line">
              {para}
            </p>
          ))}
          <p className="text-ink-soft">
            [Their personal link]
            <br />
            This link is for you alone; please do not forward it.
          </p>
          <p className="text-xs text-ink-muted">[Link to stop e-mails about this survey]</p>
        </div>
      )}
      {duration === null && (
        <p className="mt-2 text-xs text-ink-muted">
          The consent page does not say how long the survey takes, so the default wording leaves the
          duration out and {'{duration}'} cannot be used.
        </p>
      )}
    </section>
  );
}
