import { Info } from 'lucide-react';
import type { TeardownDto } from '@splitcase/contracts';

export interface EditGate {
  /** The user may change this section now (the server's `permissions.edit`: false while in review). */
  canEdit: boolean;
  /** The teardown is published: a change asks first (withUnpublishConfirm) and moves it back to draft. */
  published: boolean;
  /** In review and the user may withdraw it: read-only until withdrawn (the button is in the header). */
  withdrawable: boolean;
}

/**
 * Whether a teardown section is editable now. Writes themselves go through `withUnpublishConfirm`
 * (lib/unpublish-confirm.ts), which asks before a change moves a published teardown back to draft.
 */
export function useEditGate(teardown: TeardownDto): EditGate {
  return {
    canEdit: teardown.permissions.edit,
    published: teardown.permissions.edit && teardown.status === 'published',
    withdrawable: teardown.permissions.withdraw,
  };
}

/** A line above an editable section saying what a change does (published) or why it is read-only (in review). */
export function PublishedEditNotice({ gate }: { gate: EditGate }) {
  const text = gate.withdrawable
    ? 'In review, so read-only. To change it, withdraw it from review (at the top of the page); it needs submitting again.'
    : gate.published
      ? 'Published: saving a change asks first, then moves it back to draft for review.'
      : null;
  if (!text) return null;
  return (
    <p className="flex items-center gap-2 rounded-md border border-cell-100 bg-cell-50 px-3 py-2 text-sm text-cell-800" role="note">
      <Info className="size-4 shrink-0" aria-hidden /> {text}
    </p>
  );
}
