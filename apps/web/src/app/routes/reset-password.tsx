import { useSearchParams } from 'react-router';
import { AuthLayout } from '@/features/auth/components/auth-layout';
import { ConfirmResetForm } from '@/features/auth/components/password-reset-forms';

export function Component() {
  const [params] = useSearchParams();
  return (
    <AuthLayout title="Choose a new password">
      <ConfirmResetForm token={params.get('token') ?? ''} />
    </AuthLayout>
  );
}
