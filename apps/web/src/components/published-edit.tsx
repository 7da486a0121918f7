import { useState } from 'react';
import { PencilLine } from 'lucide-react';
import { CONFIRM_UNPUBLISH_HEADER, type TeardownDto } from '@splitcase/contracts';
import { Button } from './button';

export interface EditGate {
  /** Published, and the user chose to edit anyway: the first change moves it back to draft. */
  unlockedPublished: boolean;
  /** The user may change this section now. */
  canEdit: boolean;
  /** Published and not yet unlocked: show PublishedEditNotice. */
  locked: boolean;
  unlock: () => void;
  /** Headers for write requests: the confirm header once a published teardown is unlocked. */
  headers: Record<string, string> | undefined;
}

/**
 * Editing a published teardown moves it back to draft (the server asks for a confirm header). The
 * section stays read-only until the user chooses to edit anyway; after the first change the
 * teardown is a draft and the gate opens by itself.
 */
export function useEditGate(teardown: TeardownDto): EditGate {
  const [unlocked, setUnlocked] = useState(false);
  const published = teardown.status === 'published';
  const locked = published && !unlocked;
  return {
    unlockedPublished: teardown.permissions.edit && published && unlocked,
    canEdit: teardown.permissions.edit && !locked,
    locked: teardown.permissions.edit && locked,
    unlock: () => setUnlocked(true),
    headers: published ? { [CONFIRM_UNPUBLISH_HEADER]: 'yes' } : undefined,
  };
}

export function PublishedEditNotice({ gate }: { gate: EditGate }) {
  if (gate.unlockedPublished) {
    return (
      <p className="rounded-md border border-amber-100 bg-amber-50 px-3 py-2 text-sm text-amber-800" role="note">
        Editing a published teardown: your first change moves it back to draft for review.
      </p>
    );
  }
  if (!gate.locked) return null;
  return (
    <div className="flex flex-wrap items-center justify-between gap-3 rounded-md border border-cell-100 bg-cell-50 px-3 py-2 text-sm text-cell-800" role="note">
      <p>This teardown is published. A change moves it back to draft, and it needs review again.</p>
      <Button size="sm" onClick={gate.unlock}>
        <PencilLine className="size-4" aria-hidden /> Edit anyway
      </Button>
    </div>
  );
}
