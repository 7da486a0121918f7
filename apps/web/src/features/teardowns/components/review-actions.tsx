import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { toast } from 'sonner';
import { CircleCheck, PencilLine, Send, Undo2 } from 'lucide-react';
import { sendBackTeardownBody, type SendBackTeardownBody, type TeardownDto } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { Dialog } from '@/components/dialog';
import { Field, Textarea, FormError } from '@/components/field';
import { applyServerErrors } from '@/lib/form-errors';
import { useApproveTeardown } from '../api/approve-teardown';
import { useSendBackTeardown } from '../api/send-back-teardown';
import { useSubmitTeardown } from '../api/submit-teardown';
import { useWithdrawTeardown } from '../api/withdraw-teardown';

/** The review buttons of the teardown header, per status and what the person may do. */
export function ReviewActions({ teardown: t }: { teardown: TeardownDto }) {
  const submit = useSubmitTeardown(t.id);
  const approve = useApproveTeardown(t.id);
  const withdraw = useWithdrawTeardown(t.id);
  const [dialog, setDialog] = useState<'submit' | 'approve' | 'send-back' | null>(null);
  const [note, setNote] = useState('');
  const close = () => {
    setDialog(null);
    setNote('');
  };
  const run = async (what: 'submit' | 'approve') => {
    try {
      if (what === 'submit') {
        await submit.mutateAsync(note);
        toast.success('Submitted. The leads have an e-mail with a link.');
      } else {
        await approve.mutateAsync(note);
        toast.success('Approved and published.');
      }
      close();
    } catch (err) {
      toast.error((err as Error).message);
    }
  };
  const withdrawToEdit = () =>
    withdraw.mutate(undefined, { onSuccess: () => toast.success('Withdrawn from review: it is a draft again. Submit it again when it is ready.'), onError: (e) => toast.error(e.message) });
  const canSubmit = t.status === 'draft' && t.permissions.edit;
  const canReview = t.status === 'in_review' && t.permissions.review;
  const canWithdraw = t.permissions.withdraw;
  if (!canSubmit && !canReview && !canWithdraw) return null;
  return (
    <div className="no-print flex flex-wrap items-center gap-2">
      {canWithdraw && (
        <>
          <p className="text-sm text-graphite-500">Waiting for a lead to review it.</p>
          <Button busy={withdraw.isPending} onClick={withdrawToEdit}>
            <PencilLine className="size-4" aria-hidden /> Withdraw from review to edit
          </Button>
        </>
      )}
      {canSubmit && (
        <Button variant="primary" onClick={() => setDialog('submit')}>
          <Send className="size-4" aria-hidden /> Submit for review
        </Button>
      )}
      {canReview && (
        <>
          <Button onClick={() => setDialog('send-back')}>
            <Undo2 className="size-4" aria-hidden /> Send back
          </Button>
          <Button variant="primary" onClick={() => setDialog('approve')}>
            <CircleCheck className="size-4" aria-hidden /> Approve and publish
          </Button>
        </>
      )}
      <Dialog
        open={dialog === 'submit' || dialog === 'approve'}
        onClose={close}
        title={dialog === 'approve' ? 'Approve and publish' : 'Submit for review'}
        footer={
          <>
            <Button onClick={close}>Cancel</Button>
            <Button variant="primary" busy={submit.isPending || approve.isPending} onClick={() => run(dialog === 'approve' ? 'approve' : 'submit')}>
              {dialog === 'approve' ? 'Approve and publish' : 'Submit'}
            </Button>
          </>
        }
      >
        <p className="mb-3 text-graphite-700">
          {dialog === 'approve'
            ? 'Published teardowns are visible to viewers. Any later change moves it back to draft.'
            : 'Every lead gets an e-mail with a link to this teardown. It stays read-only for review until a lead approves it or sends it back.'}
        </p>
        <Field label="Note (optional)">{(p) => <Textarea {...p} rows={3} value={note} onChange={(e) => setNote(e.target.value)} />}</Field>
      </Dialog>
      {dialog === 'send-back' && <SendBackDialog teardown={t} onClose={close} />}
    </div>
  );
}

function SendBackDialog({ teardown: t, onClose }: { teardown: TeardownDto; onClose: () => void }) {
  const sendBack = useSendBackTeardown(t.id);
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, setError, formState } = useForm<SendBackTeardownBody>({ resolver: zodResolver(sendBackTeardownBody), defaultValues: { comment: '' } });
  const submit = handleSubmit(async (values) => {
    try {
      await sendBack.mutateAsync(values);
      toast.success(`Sent back to ${t.engineer.name}.`);
      onClose();
    } catch (err) {
      setFormError(applyServerErrors(err, setError, ['comment']));
    }
  });
  return (
    <Dialog
      open
      onClose={onClose}
      title="Send back to draft"
      footer={
        <>
          <Button onClick={onClose}>Cancel</Button>
          <Button variant="primary" type="submit" form="send-back-form" busy={sendBack.isPending}>
            Send back
          </Button>
        </>
      }
    >
      <form id="send-back-form" onSubmit={submit} noValidate className="space-y-3">
        <p className="text-graphite-700">{t.engineer.name} gets an e-mail with your comment. Say what to change.</p>
        <Field label="Comment" error={formState.errors.comment?.message}>
          {(p) => <Textarea {...p} rows={4} {...register('comment')} />}
        </Field>
        <FormError message={formError} />
      </form>
    </Dialog>
  );
}
