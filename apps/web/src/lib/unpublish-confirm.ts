// Writes to a published teardown move it back to draft. The server refuses them with 409
// (`details.reason = 'published'`) unless the request carries X-Confirm-Unpublish: yes. This helper
// asks the person first and retries with the header; every feature's teardown mutations use it:
//
//   mutationFn: (body) => withUnpublishConfirm((opts) => api.post(`/api/teardowns/${id}/parts`, body, opts))
import { CONFIRM_UNPUBLISH_HEADER, type TeardownDto } from '@splitcase/contracts';
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

const UNPUBLISH_DIALOG = {
  title: 'Move this teardown back to draft?',
  message: 'It is published. Saving this change moves it back to draft, and a lead will need to approve it again before viewers see it.',
  confirmLabel: 'Save and move to draft',
  cancelLabel: 'Keep it published',
  tone: 'danger',
} as const;
const CONFIRMED: Pick<RequestOptions, 'headers'> = { headers: { [CONFIRM_UNPUBLISH_HEADER]: 'yes' } };

/**
 * Run a teardown write; if the teardown is published, ask whether to move it back to draft and, on
 * yes, run it again with the confirm header. On no, rejects with UnpublishCancelled.
 */
export async function withUnpublishConfirm<T>(run: (opts: Pick<RequestOptions, 'headers'>) => Promise<T>): Promise<T> {
  try {
    return await run({});
  } catch (err) {
    if (!isUnpublishRefusal(err)) throw err;
    if (!(await confirmDialog(UNPUBLISH_DIALOG))) throw new UnpublishCancelled();
    return run(CONFIRMED);
  }
}

/**
 * For a write that cannot simply be tried again (an upload): when the teardown is published, ask
 * first, with the same dialog. Resolves to the request options to send; on no, rejects with
 * UnpublishCancelled.
 */
export async function confirmUnpublishFirst(teardown: Pick<TeardownDto, 'status'>): Promise<Pick<RequestOptions, 'headers'>> {
  if (teardown.status !== 'published') return {};
  if (!(await confirmDialog(UNPUBLISH_DIALOG))) throw new UnpublishCancelled();
  return CONFIRMED;
}

/** The message to show for a failed mutation, or null when the person cancelled on purpose. */
export function mutationErrorMessage(err: unknown): string | null {
  if (isUnpublishCancelled(err)) return null;
  return err instanceof Error ? err.message : 'Something went wrong.';
}
