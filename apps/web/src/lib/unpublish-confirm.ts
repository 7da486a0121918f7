// Writes to a published teardown move it back to draft. The server refuses them with 409
// (`details.reason = 'published'`) unless the request carries X-Confirm-Unpublish: yes. This helper
// asks the person first and retries with the header; every feature's teardown mutations use it:
//
//   mutationFn: (body) => withUnpublishConfirm((opts) => api.post(`/api/teardowns/${id}/parts`, body, opts))
import { CONFIRM_UNPUBLISH_HEADER } from '@splitcase/contracts';
import { ApiError, type RequestOptions } from './api-client';
import { confirmDialog } from './confirm';

/** Thrown when the person chose not to move the teardown back to draft: nothing was saved. */
export class UnpublishCancelled extends Error {
  constructor() {
    super('Not saved: the teardown stays published.');
    this.name = 'UnpublishCancelled';
  }
}

export function isUnpublishRefusal(err: unknown): boolean {
  return err instanceof ApiError && err.status === 409 && (err.details as { reason?: string } | undefined)?.reason === 'published';
}

export const isUnpublishCancelled = (err: unknown): err is UnpublishCancelled => err instanceof UnpublishCancelled;

/**
 * Run a teardown write; if the teardown is published, ask whether to move it back to draft and, on
 * yes, run it again with the confirm header. On no, rejects with UnpublishCancelled.
 */
export async function withUnpublishConfirm<T>(run: (opts: Pick<RequestOptions, 'headers'>) => Promise<T>): Promise<T> {
  try {
    return await run({});
  } catch (err) {
    if (!isUnpublishRefusal(err)) throw err;
    const ok = await confirmDialog({
      title: 'Move this teardown back to draft?',
      message: 'It is published. Saving this change moves it back to draft, and a lead will need to approve it again before viewers see it.',
      confirmLabel: 'Save and move to draft',
      cancelLabel: 'Keep it published',
      tone: 'danger',
    });
    if (!ok) throw new UnpublishCancelled();
    return run({ headers: { [CONFIRM_UNPUBLISH_HEADER]: 'yes' } });
  }
}

/** The message to show for a failed mutation, or null when the person cancelled on purpose. */
export function mutationErrorMessage(err: unknown): string | null {
  if (isUnpublishCancelled(err)) return null;
  return err instanceof Error ? err.message : 'Something went wrong.';
}
