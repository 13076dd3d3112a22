import { Link, useNavigate, useSearchParams } from 'react-router';
import { paths } from '@/config/paths';
import { AuthLayout } from '@/components/layout/auth-layout';
import { SignUpForm } from '@/features/auth/components/sign-up-form';
import { safeRedirect, withAuthParams } from './safe-redirect';

export function Component() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const email = params.get('email') ?? '';
  const redirectTo = params.get('redirectTo');
  // Coming from an invitation: the person joins that team next, so their own team is secondary.
  const invited = !!redirectTo?.startsWith('/invitations/');

  return (
    <AuthLayout
      title="Create your Choicewright account"
      footer={
        <>
          Already have an account?{' '}
          <Link
            className="font-medium text-primary underline"
            to={withAuthParams(paths.signIn.getHref(), params)}
          >
            Sign in
          </Link>
        </>
      }
    >
      <SignUpForm
        defaultValues={{ email, teamName: invited ? 'My workspace' : '' }}
        teamHint={
          invited
            ? 'Every account gets a team of its own. You join the team that invited you next.'
            : undefined
        }
        onSignedUp={(me) =>
          navigate(
            safeRedirect(redirectTo, me.teams[0] ? paths.studies.getHref(me.teams[0].id) : '/'),
            { replace: true },
          )
        }
      />
    </AuthLayout>
  );
}
