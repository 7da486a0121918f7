import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router';
import { searchStateFromParams, searchStateToQuery, type SearchState } from '@splitcase/contracts';

/**
 * The explorer's search, read from the URL and written back to it: the address always holds the
 * whole query (a link reproduces it; back and forward step through the changes). `replace` changes
 * the current history entry instead of adding one (while typing).
 */
export function useSearchState(): [SearchState, (next: SearchState, options?: { replace?: boolean }) => void] {
  const [params, setParams] = useSearchParams();
  const state = useMemo(() => searchStateFromParams(params), [params]);
  const set = useCallback((next: SearchState, options?: { replace?: boolean }) => setParams(new URLSearchParams(searchStateToQuery(next)), { replace: options?.replace ?? false }), [setParams]);
  return [state, set];
}
