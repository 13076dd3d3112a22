/**
 * The account's open sign-in sessions: where (browser and system, never the raw user agent),
 * since when and last active; sign out any other one, or everywhere at once.
 */
import { Button } from '@/components/ui/button';
import { Alert, Spinner } from '@/components/ui/feedback';
import { useSessions } from '../api/get-sessions';
import { useSignOutSession } from '../api/sign-out-session';
import { useSignOutEverywhere } from '../api/sign-out-everywhere';
import { formatDateTime } from '@/utils/format';

export function SessionsList({ onSignedOutEverywhere }: { onSignedOutEverywhere: () => void }) {
  const sessions = useSessions();
  const signOut = useSignOutSession();
  const everywhere = useSignOutEverywhere();

  if (sessions.isPending) return <Spinner />;
  if (sessions.error) return <Alert tone="danger">{sessions.error.message}</Alert>;

  return (
    <div className="space-y-4">
      <p className="text-sm text-ink-soft">
        A session ends after 30 minutes without activity and 12 hours after signing in at the
        latest.
      </p>
      <ul
        aria-label="Signed-in sessions"
        className="divide-y divide-line rounded-md border border-line"
      >
        {sessions.data.map((s) => (
          <li key={s.id} className="flex flex-wrap items-center justify-between gap-3 px-4 py-3">
            <div className="min-w-0">
              <p className="font-medium text-ink">
                {s.device}
                {s.current && (
                  <span className="ml-2 rounded bg-primary-soft px-2 py-0.5 text-xs text-primary">
                    This browser
                  </span>
                )}
              </p>
              <p className="text-xs text-ink-muted">
                Signed in {formatDateTime(s.createdAt)} · last active {formatDateTime(s.lastSeenAt)}
              </p>
            </div>
            {!s.current && (
              <Button
                variant="secondary"
                size="sm"
                aria-label={`Sign out ${s.device}, signed in ${formatDateTime(s.createdAt)}`}
                busy={signOut.isPending && signOut.variables === s.id}
                onClick={() => signOut.mutate(s.id)}
              >
                Sign out
              </Button>
            )}
          </li>
        ))}
      </ul>
      {signOut.error && <Alert tone="danger">{signOut.error.message}</Alert>}
      <div className="flex flex-wrap items-center gap-3">
        <Button
          variant="danger"
          busy={everywhere.isPending}
          onClick={() => everywhere.mutate(undefined, { onSuccess: onSignedOutEverywhere })}
        >
          Sign out everywhere
        </Button>
        <span className="text-xs text-ink-muted">Ends every session, this one too.</span>
      </div>
    </div>
  );
}
