import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { toast } from 'sonner';
import { createInvitationBody, ROLES, ROLE_LABELS, type CreateInvitationBody, type Invitation } from '@splitcase/contracts';
import { Clock, CircleCheck, CircleSlash, CircleX } from 'lucide-react';
import { Badge } from '@/components/badges';
import { Button } from '@/components/button';
import { DataTable, type Column } from '@/components/data-table';
import { ErrorPanel } from '@/components/error-boundary';
import { Field, Input, Select, FormError } from '@/components/field';
import { Card, Spinner } from '@/components/page';
import { applyServerErrors } from '@/lib/form-errors';
import { formatDate } from '@/lib/format';
import { useCreateInvitation } from '../api/create-invitation';
import { useInvitations } from '../api/invitations';
import { useRevokeInvitation } from '../api/revoke-invitation';

const STATUS = {
  pending: { tone: 'amber', icon: Clock, label: 'Pending' },
  accepted: { tone: 'cell', icon: CircleCheck, label: 'Accepted' },
  expired: { tone: 'neutral', icon: CircleX, label: 'Expired' },
  revoked: { tone: 'neutral', icon: CircleSlash, label: 'Revoked' },
} as const;

function InviteForm() {
  const create = useCreateInvitation();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, reset, setError, formState } = useForm<CreateInvitationBody>({
    resolver: zodResolver(createInvitationBody),
    defaultValues: { email: '', role: 'engineer' },
  });
  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await create.mutateAsync(values);
      toast.success(`Invitation sent to ${values.email}.`);
      reset({ email: '', role: values.role });
    } catch (err) {
      setFormError(applyServerErrors(err, setError, ['email', 'role']));
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-wrap items-start gap-3 p-4">
      <Field label="E-mail address" error={formState.errors.email?.message} className="min-w-64 flex-1">
        {(p) => <Input {...p} type="email" placeholder="name@example.test" {...register('email')} />}
      </Field>
      <Field label="Role" error={formState.errors.role?.message} className="w-44">
        {(p) => (
          <Select {...p} {...register('role')}>
            {ROLES.map((r) => (
              <option key={r} value={r}>
                {ROLE_LABELS[r]}
              </option>
            ))}
          </Select>
        )}
      </Field>
      <div className="pt-6">
        <Button type="submit" variant="primary" busy={create.isPending}>
          Send invitation
        </Button>
      </div>
      <FormError message={formError} className="w-full" />
    </form>
  );
}

export function InvitationsPanel() {
  const invitations = useInvitations();
  const revoke = useRevokeInvitation();
  const columns: Column<Invitation>[] = [
    { id: 'email', header: 'E-mail', value: (i) => i.email, filter: 'text', className: 'font-mono text-xs' },
    { id: 'role', header: 'Role', value: (i) => ROLE_LABELS[i.role], filter: 'select' },
    {
      id: 'status',
      header: 'Status',
      value: (i) => STATUS[i.status].label,
      filter: 'select',
      cell: (i) => (
        <Badge tone={STATUS[i.status].tone} icon={STATUS[i.status].icon}>
          {STATUS[i.status].label}
        </Badge>
      ),
    },
    { id: 'by', header: 'Invited by', value: (i) => i.invitedBy ?? '' },
    { id: 'sent', header: 'Sent', value: (i) => i.createdAt, cell: (i) => formatDate(i.createdAt) },
    { id: 'expires', header: 'Expires', value: (i) => i.expiresAt, cell: (i) => formatDate(i.expiresAt) },
    {
      id: 'actions',
      header: '',
      value: () => '',
      sortable: false,
      align: 'right',
      cell: (i) =>
        i.status === 'pending' ? (
          <Button size="sm" variant="danger" onClick={() => revoke.mutate(i.id, { onSuccess: () => toast.success('Invitation revoked.'), onError: (e) => toast.error(e.message) })}>
            Revoke
          </Button>
        ) : null,
    },
  ];
  return (
    <div className="space-y-6">
      <Card title="Invite someone">
        <InviteForm />
      </Card>
      {invitations.isPending ? (
        <Spinner />
      ) : invitations.isError ? (
        <ErrorPanel error={invitations.error} />
      ) : (
        <DataTable caption="Invitations" rows={invitations.data} columns={columns} rowId={(i) => String(i.id)} empty="No invitations yet. Invite a colleague above." />
      )}
    </div>
  );
}
