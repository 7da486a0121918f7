import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { CircleCheck, Eye, MessageSquare, Undo2 } from 'lucide-react';
import { createCommentBody, type CommentDto, type CreateCommentBody, type TeardownDto } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { ErrorPanel } from '@/components/error-boundary';
import { Field, Textarea, FormError } from '@/components/field';
import { Card, EmptyState, Spinner } from '@/components/page';
import { applyServerErrors } from '@/lib/form-errors';
import { formatDateTime } from '@/lib/format';
import { useComments } from '../api/comments';
import { usePostComment } from '../api/post-comment';

const KIND = {
  comment: { icon: MessageSquare, label: null, ring: 'ring-graphite-150' },
  submitted: { icon: Eye, label: 'Submitted for review', ring: 'ring-amber-100' },
  'sent-back': { icon: Undo2, label: 'Sent back to draft', ring: 'ring-amber-100' },
  approved: { icon: CircleCheck, label: 'Approved and published', ring: 'ring-cell-100' },
} as const;

function CommentItem({ c }: { c: CommentDto }) {
  const k = KIND[c.kind];
  return (
    <li className={`rounded-md bg-white px-3 py-2.5 ring-1 ${k.ring}`}>
      <div className="flex flex-wrap items-center gap-x-2 text-xs text-graphite-500">
        <k.icon className="size-3.5" aria-hidden />
        <span className="font-medium text-graphite-800">{c.author?.name ?? 'Former user'}</span>
        {k.label && <span className="font-medium text-graphite-700">{k.label}</span>}
        <time dateTime={c.createdAt}>{formatDateTime(c.createdAt)}</time>
      </div>
      <p className="mt-1 whitespace-pre-wrap text-sm text-graphite-900">{c.body}</p>
    </li>
  );
}

/** The conversation on a teardown, review steps included. */
export function CommentsSection({ teardown }: { teardown: TeardownDto }) {
  const comments = useComments(teardown.id);
  const post = usePostComment(teardown.id);
  const [formError, setFormError] = useState<string | null>(null);
  const { register, handleSubmit, reset, setError, formState } = useForm<CreateCommentBody>({ resolver: zodResolver(createCommentBody), defaultValues: { body: '' } });
  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await post.mutateAsync(values);
      reset({ body: '' });
    } catch (err) {
      setFormError(applyServerErrors(err, setError, ['body']));
    }
  });
  return (
    <div className="space-y-4">
      <Card title="Comments">
        <div className="p-4">
          {comments.isPending ? (
            <Spinner />
          ) : comments.isError ? (
            <ErrorPanel error={comments.error} onRetry={() => comments.refetch()} />
          ) : comments.data.length === 0 ? (
            <EmptyState
              icon={<MessageSquare className="size-8" />}
              message={teardown.permissions.comment ? 'No comments yet. Ask a question or leave a note for the team below.' : 'No comments on this teardown.'}
            />
          ) : (
            <ol className="space-y-2" aria-label="Comments">
              {comments.data.map((c) => (
                <CommentItem key={c.id} c={c} />
              ))}
            </ol>
          )}
        </div>
      </Card>
      {teardown.permissions.comment && (
        <Card>
          <form onSubmit={submit} noValidate className="space-y-3 p-4" aria-label="New comment">
            <Field label="Your comment" error={formState.errors.body?.message}>
              {(p) => (
                <Textarea
                  {...p}
                  rows={3}
                  {...register('body')}
                  onKeyDown={(e) => {
                    if (e.key === 'Enter' && (e.ctrlKey || e.metaKey)) void submit();
                  }}
                />
              )}
            </Field>
            <FormError message={formError} />
            <div className="flex items-center gap-3">
              <Button type="submit" variant="primary" busy={post.isPending}>
                Post comment
              </Button>
              <span className="text-xs text-graphite-500">Ctrl+Enter posts.</span>
            </div>
          </form>
        </Card>
      )}
    </div>
  );
}
