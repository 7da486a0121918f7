import { useCallback, useRef } from 'react';
import { CONFIRM_UNPUBLISH_HEADER, type TeardownDto } from '@splitcase/contracts';

const CONFIRMED = { [CONFIRM_UNPUBLISH_HEADER]: 'yes' };

/**
 * Headers for a change to this teardown. A published teardown goes back to draft when changed, so
 * the first change asks first (once per visit); resolves to null when the user declines.
 */
export function useWriteHeaders(teardown: Pick<TeardownDto, 'status'>) {
  const confirmed = useRef(false);
  return useCallback(async (): Promise<Record<string, string> | null> => {
    if (confirmed.current) return CONFIRMED;
    if (teardown.status !== 'published') return {};
    const ok = window.confirm('This teardown is published. Changing its photos moves it back to draft, and it will need review again. Go ahead?');
    if (!ok) return null;
    confirmed.current = true;
    return CONFIRMED;
  }, [teardown.status]);
}
