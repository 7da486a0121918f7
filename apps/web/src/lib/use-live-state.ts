import { useCallback, useRef, useState } from 'react';

/**
 * State for pointer gestures (drags, brush selections): the value renders like `useState`, and
 * `get()` returns the latest value at once. Pointer events can arrive faster than React re-renders;
 * a handler that read the state of the last render would miss the press before the moves.
 */
export function useLiveState<T>(initial: T): [T, (next: T) => void, () => T] {
  const [value, setValue] = useState(initial);
  const ref = useRef(initial);
  const set = useCallback((next: T) => {
    ref.current = next;
    setValue(next);
  }, []);
  const get = useCallback(() => ref.current, []);
  return [value, set, get];
}
