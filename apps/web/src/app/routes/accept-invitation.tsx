import { useSearchParams } from 'react-router';
import { AuthLayout } from '@/features/auth/components/auth-layout';
import { AcceptInvitationForm } from '@/features/auth/components/accept-invitation-form';

export function Component() {
  const [params] = useSearchParams();
  return (
    <AuthLayout title="Join your team on Splitcase">
      <AcceptInvitationForm token={params.get('token') ?? ''} />
    </AuthLayout>
  );
}
