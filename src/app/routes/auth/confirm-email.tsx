/**
 * The page behind the confirmation link of the sign-up e-mail: confirms the address once (the
 * token is sent in a POST, so mail scanners that only open links confirm nothing until the
 * person presses the button), then goes on to the studies or to where sign-up started.
 */
import { useNavigate, useSearchParams } from 'react-router';
import { paths } from '@/config/paths';
import { AuthLayout } from '@/components/layout/auth-layout';
import { Alert } from '@/components/ui/feedback';
import { Button } from '@/components/ui/button';
import { useConfirmEmail } from '@/features/auth/api/confirm-email';
import { safeRedirect } from './safe-redirect';
import { BackToSignIn } from './back-to-sign-in';

export function Component() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const confirm = useConfirmEmail();

  const onConfirm = async () => {
    const me = await confirm.mutateAsync({ token });
    const home = me.teams[0] ? paths.studies.getHref(me.teams[0].id) : paths.home.getHref();
    navigate(safeRedirect(params.get('redirectTo'), home), { replace: true });
  };

  return (
    <AuthLayout title="Confirm your e-mail address" footer={<BackToSignIn />}>
      {token.length < 20 ? (
        <Alert tone="danger" title="This confirmation link is incomplete">
          Open the link from the e-mail again. Signing in sends a new one.
        </Alert>
      ) : (
        <div className="space-y-4">
          <p className="text-sm text-ink-soft">
            One step left: confirm that this address is yours, and you are signed in.
          </p>
          {confirm.error && <Alert tone="danger">{confirm.error.message}</Alert>}
          <Button
            className="w-full"
            busy={confirm.isPending}
            onClick={() => void onConfirm().catch(() => {})}
          >
            Confirm and sign in
          </Button>
        </div>
      )}
    </AuthLayout>
  );
}
