import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { SEARCH_PAGE_SIZE, searchApiQuery, type SearchResponse, type SearchState } from '@splitcase/contracts';
import { api } from '@/lib/api-client';
import { rootKeys } from '@/lib/query-keys';

/** GET /api/search for an explorer state (its page as limit/offset). */
export const getSearch = (state: SearchState, signal?: AbortSignal) => api.get<SearchResponse>(`/api/search?${searchApiQuery(state, SEARCH_PAGE_SIZE)}`, { signal });
export const searchQueryOptions = (state: SearchState, enabled = true) =>
  queryOptions({
    enabled,
    queryKey: [...rootKeys.search, searchApiQuery(state, SEARCH_PAGE_SIZE)],
    queryFn: ({ signal }) => getSearch(state, signal),
    // Keep showing the last results while the next query runs (no flashing empty table while typing).
    placeholderData: keepPreviousData,
  });
/** `enabled: false` while the state cannot be asked (an inverted date range the page already explains). */
export const useSearch = (state: SearchState, enabled = true) => useQuery(searchQueryOptions(state, enabled));
