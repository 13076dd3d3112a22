/** What the unsubscribe link shows: which survey, a masked address, and one button. */
import { Alert, Spinner } from '@/components/ui/feedback';
import { Button } from '@/components/ui/button';
import { ErrorText } from '@/components/ui/error-boundary';
import { ApiError } from '@/lib/api-client';
import { useUnsubscribeStatus } from '../api/get-unsubscribe-status';
import { useUnsubscribe } from '../api/unsubscribe';

export function UnsubscribeCard({ token }: { token: string }) {
  const status = useUnsubscribeStatus(token);
  const unsubscribe = useUnsubscribe(token);

  if (status.isPending) return <Spinner />;
  if (status.error) {
    const unknown =
      status.error instanceof ApiError &&
      (status.error.status === 404 || status.error.status === 400);
    return unknown ? (
      <Alert tone="warning" title="This link is not valid">
        Check that the whole link from the e-mail was opened. If the invitation was removed, you
        will not receive more e-mails about it.
      </Alert>
    ) : (
      <ErrorText error={status.error} />
    );
  }
  const s = status.data;
  if (s.unsubscribed)
    return (
      <Alert tone="success" title="You are unsubscribed">
        {s.maskedEmail} will not receive any more e-mails about “{s.studyName}”.
      </Alert>
    );
  return (
    <div className="space-y-4 text-sm text-ink">
      <p>
        Stop e-mails about the survey <strong>“{s.studyName}”</strong> to{' '}
        <span className="font-mono">{s.maskedEmail}</span>?
      </p>
      <p className="text-ink-soft">
        No further invitations or reminders will be sent. Answers you may already have given are not
        affected.
      </p>
      <Button className="w-full" busy={unsubscribe.isPending} onClick={() => unsubscribe.mutate()}>
        Unsubscribe
      </Button>
      <ErrorText error={unsubscribe.error} />
    </div>
  );
}
