import { ROLE_DESCRIPTIONS, ROLE_LABELS } from '@splitcase/contracts';
import { Card, PageHeader } from '@/components/page';
import { ChangePasswordForm } from '@/features/auth/components/change-password-form';
import { useSignedInUser } from '@/lib/session';

/** Your account: who you are in the workspace, and your password. */
export function Component() {
  const me = useSignedInUser();
  return (
    <>
      <PageHeader title="Your account" subtitle={`${me.name} · ${me.email}`} />
      <div className="space-y-6">
        <Card title="Role">
          <p className="p-4 text-sm text-graphite-700">
            <span className="font-medium">{ROLE_LABELS[me.role]}</span>: {ROLE_DESCRIPTIONS[me.role]}
          </p>
        </Card>
        <Card title="Password">
          <div className="p-4">
            <ChangePasswordForm />
          </div>
        </Card>
      </div>
    </>
  );
}
