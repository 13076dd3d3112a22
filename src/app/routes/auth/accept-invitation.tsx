import { Link, useNavigate, useParams } from 'react-router';
import { paths } from '@/config/paths';
import { AuthLayout } from '@/components/layout/auth-layout';
import { Alert, Spinner } from '@/components/ui/feedback';
import { Button } from '@/components/ui/button';
import { ErrorText } from '@/components/ui/error-boundary';
import { ApiError } from '@/lib/api-client';
import { useMe } from '@/features/auth/api/get-me';
import { useSignOut } from '@/features/auth/api/sign-out';
import { useRefreshMe } from '@/features/auth/hooks/use-refresh-me';
import { useInvitationPreview } from '@/features/team/api/get-invitation-preview';
import { useAcceptInvitation } from '@/features/team/api/accept-invitation';
import { InvitationSummary } from '@/features/team/components/invitation-summary';

const linkButton =
  'inline-flex h-10 w-full items-center justify-center rounded-md px-4 text-sm font-medium';

export function Component() {
  const { token = '' } = useParams();
  const navigate = useNavigate();
  const preview = useInvitationPreview(token);
  const me = useMe();
  const signOut = useSignOut();
  const refreshMe = useRefreshMe();
  const accept = useAcceptInvitation({
    onSuccess: async ({ teamId }) => {
      await refreshMe();
      navigate(paths.members.getHref(teamId), { replace: true });
    },
  });

  if (preview.isPending || me.isPending) {
    return (
      <AuthLayout title="Team invitation">
        <Spinner />
      </AuthLayout>
    );
  }
  if (preview.isError) {
    const gone = preview.error instanceof ApiError && preview.error.status === 400;
    return (
      <AuthLayout title="Team invitation">
        <Alert tone="danger" title={gone ? 'This invitation cannot be used' : 'Something failed'}>
          {gone
            ? 'The link is invalid, was already used, was cancelled or has expired. Ask the person who invited you to send a new one.'
            : preview.error.message}
        </Alert>
      </AuthLayout>
    );
  }

  const invitation = preview.data;
  const here = paths.acceptInvitation.getHref(token);
  const authQuery = new URLSearchParams({ redirectTo: here, email: invitation.email }).toString();
  const user = me.data;
  const sameAddress = user?.email.toLowerCase() === invitation.email.toLowerCase();

  return (
    <AuthLayout title="Join a team on Choicewright">
      <div className="space-y-5">
        <InvitationSummary invitation={invitation} />
        {!user && (
          <div className="space-y-3">
            <p className="text-sm text-ink-soft">
              To accept, use an account with the address {invitation.email}.
            </p>
            <Link
              to={`${paths.signUp.getHref()}?${authQuery}`}
              className={`${linkButton} bg-primary text-white hover:bg-primary-strong`}
            >
              Create an account
            </Link>
            <Link
              to={`${paths.signIn.getHref()}?${authQuery}`}
              className={`${linkButton} border border-line bg-white text-ink hover:border-primary hover:text-primary`}
            >
              I have an account: sign in
            </Link>
          </div>
        )}
        {user && sameAddress && (
          <div className="space-y-3">
            <ErrorText error={accept.error} />
            <Button className="w-full" busy={accept.isPending} onClick={() => accept.mutate(token)}>
              Accept and join the team
            </Button>
          </div>
        )}
        {user && !sameAddress && (
          <div className="space-y-3">
            <Alert tone="warning" title="You are signed in with another address">
              You are signed in as {user.email}, but this invitation is for {invitation.email}. Sign
              out, then sign in or create an account with the invited address.
            </Alert>
            <Button
              variant="secondary"
              className="w-full"
              busy={signOut.isPending}
              onClick={() => signOut.mutate()}
            >
              Sign out of {user.email}
            </Button>
          </div>
        )}
      </div>
    </AuthLayout>
  );
}
