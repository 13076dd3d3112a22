import { Link } from 'react-router';
import { paths } from '@/config/paths';

/** The footer link of the auth pages one reaches from sign-in (a forgotten password, a link). */
export function BackToSignIn() {
  return (
    <Link className="font-medium text-primary underline" to={paths.signIn.getHref()}>
      Back to sign in
    </Link>
  );
}
