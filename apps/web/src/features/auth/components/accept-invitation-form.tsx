import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useNavigate } from 'react-router';
import { acceptInvitationBody, PASSWORD_RULE, ROLE_DESCRIPTIONS, ROLE_LABELS, type AcceptInvitationBody } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Field, Input, FormError } from '@/components/field';
import { Spinner } from '@/components/page';
import { ErrorPanel } from '@/components/error-boundary';
import { paths } from '@/config/paths';
import { applyServerErrors } from '@/lib/form-errors';
import { formatDate } from '@/lib/format';
import { useAcceptInvitation, useInvitationPreview } from '../api/invitation';

export function AcceptInvitationForm({ token }: { token: string }) {
  const preview = useInvitationPreview(token);
  const accept = useAcceptInvitation();
  const navigate = useNavigate();
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<AcceptInvitationBody>({
    resolver: zodResolver(acceptInvitationBody),
    defaultValues: { token, name: '', password: '' },
  });

  if (!token) return <ErrorPanel error={new Error('This page needs the link from your invitation e-mail.')} />;
  if (preview.isPending) return <Spinner label="Checking the invitation…" />;
  if (preview.isError) return <ErrorPanel error={preview.error} />;

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await accept.mutateAsync(values);
      navigate(paths.home(), { replace: true });
    } catch (err) {
      setFormError(applyServerErrors(err, setError, ['name', 'password']));
    }
  });

  const inv = preview.data;
  return (
    <form onSubmit={onSubmit} className="space-y-4" noValidate>
      <div className="rounded-md border border-graphite-150 bg-white p-3 text-sm">
        <p>
          <span className="font-medium">{inv.email}</span> joins as <span className="font-medium">{ROLE_LABELS[inv.role]}</span>.
        </p>
        <p className="mt-1 text-graphite-600">{ROLE_DESCRIPTIONS[inv.role]}</p>
        <p className="mt-1 text-xs text-graphite-500">The link expires on {formatDate(inv.expiresAt)}.</p>
      </div>
      <FormError message={formError} />
      <input type="hidden" {...register('token')} />
      <Field label="Your name" error={formState.errors.name?.message}>
        {(p) => <Input {...p} autoComplete="name" autoFocus {...register('name')} />}
      </Field>
      <Field label="Choose a password" error={formState.errors.password?.message} hint={PASSWORD_RULE}>
        {(p) => <Input {...p} type="password" autoComplete="new-password" {...register('password')} />}
      </Field>
      <Button type="submit" variant="primary" size="lg" className="w-full" busy={accept.isPending}>
        Join the workspace
      </Button>
    </form>
  );
}
