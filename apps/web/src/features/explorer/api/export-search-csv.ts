import { searchApiQuery, type SearchState } from '@splitcase/contracts';

/** Address of the CSV of every hit of a search (the browser downloads it with the session cookie). */
export function searchCsvUrl(state: SearchState): string {
  const params = new URLSearchParams(searchApiQuery({ ...state, page: 1 }));
  params.delete('limit');
  params.delete('offset');
  const qs = params.toString();
  return qs ? `/api/search.csv?${qs}` : '/api/search.csv';
}
