/** Public page behind the unsubscribe link of invitation e-mails (no sign-in). */
import { useParams } from 'react-router';
import { AuthLayout } from '@/components/layout/auth-layout';
import { UnsubscribeCard } from '@/features/invitees/components/unsubscribe-card';

export function Component() {
  const { token = '' } = useParams();
  return (
    <AuthLayout title="Survey e-mails">
      <UnsubscribeCard token={token} />
    </AuthLayout>
  );
}
