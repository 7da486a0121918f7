// The findings explorer's URL: the whole search lives in the query string, so a link reproduces it.
// Serialising is contracts' (searchStateToQuery / searchStateFromParams / searchApiQuery), shared
// with the API tests; this adds what the pages need around it.
import { EMPTY_SEARCH, searchStateFromParams, searchStateToQuery, type SearchState } from '@splitcase/contracts';
import { paths } from '@/config/paths';

/** The search a location's query string holds (`?q=…&kind=…`, with or without the "?"). */
export const readSearchState = (search: string): SearchState => searchStateFromParams(new URLSearchParams(search));

/** The explorer's address for a search. */
export const searchHref = (state: Partial<SearchState>): string => paths.findings(searchStateToQuery({ ...EMPTY_SEARCH, ...state }));

/** A changed search: any change but the page itself goes back to page 1. */
export function changeSearch(state: SearchState, patch: Partial<SearchState>): SearchState {
  return { ...state, ...patch, page: 'page' in patch && patch.page !== undefined ? patch.page : 1 };
}

/** The list with the value added, or removed when present. */
export function toggleValue<T>(list: readonly T[], value: T): T[] {
  return list.includes(value) ? list.filter((v) => v !== value) : [...list, value];
}
