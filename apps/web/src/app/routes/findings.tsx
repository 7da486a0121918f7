import { useMemo } from 'react';
import { ArrowDownUp, ChevronRight, Download, SearchX } from 'lucide-react';
import { SEARCH_PAGE_SIZE, SEARCH_SORT, SEARCH_SORT_DIR, type SearchSort, type SearchState } from '@splitcase/contracts';
import { Button } from '@/components/button';
import { ErrorPanel, WidgetBoundary } from '@/components/error-boundary';
import { EmptyState, PageHeader, Spinner } from '@/components/page';
import { EstimatesNote } from '@/components/safety';
import { changeSearch } from '@/lib/search-url';
import { useSignedInUser } from '@/lib/session';
import { searchCsvUrl } from '@/features/explorer/api/export-search-csv';
import { usePatterns } from '@/features/explorer/api/patterns';
import { useSearch } from '@/features/explorer/api/search';
import { ActiveFilters } from '@/features/explorer/components/active-filters';
import { FacetPanel } from '@/features/explorer/components/facet-panel';
import { Pager } from '@/features/explorer/components/pager';
import { PatternCards } from '@/features/explorer/components/pattern-cards';
import { ResultsTable } from '@/features/explorer/components/results-table';
import { SearchBox } from '@/features/explorer/components/search-box';
import { useSearchState } from '@/features/explorer/components/use-search-state';

/** The findings explorer: search and facets across every teardown the user may read, and patterns across devices. */
export function Component() {
  const me = useSignedInUser();
  const [state, setState] = useSearchState();
  const invertedDates = Boolean(state.from && state.to && state.from > state.to);
  const results = useSearch(state, !invertedDates);
  const data = results.data;
  const update = (next: SearchState) => setState(next);

  const deviceNames = useMemo(() => new Map((data?.items ?? []).map((i) => [i.deviceId, `${i.device.maker} ${i.device.model}`])), [data]);
  const sort: SearchSort = state.sort ?? data?.sort ?? (state.q ? 'relevance' : 'date');
  const dir = state.dir ?? data?.dir ?? SEARCH_SORT_DIR[sort];
  const setSort = (s: SearchSort, d = SEARCH_SORT_DIR[s]) => update(changeSearch(state, { sort: s, dir: d }));

  return (
    <>
      <PageHeader
        title="Findings explorer"
        subtitle={
          <>
            Search findings, parts, teardown summaries and comments across every teardown you can read{me.role === 'viewer' ? ' (published ones)' : ''} and see which patterns recur across devices. The
            address holds the whole search: copy it to share exactly this view.
          </>
        }
      />

      <details open className="group mb-6" aria-labelledby="patterns-heading">
        <summary className="mb-3 flex cursor-pointer list-none flex-wrap items-baseline justify-between gap-2 select-none">
          <h2 id="patterns-heading" className="inline-flex items-center gap-1.5 text-base font-semibold text-graphite-950">
            <ChevronRight className="size-4 text-graphite-400 transition-transform group-open:rotate-90" aria-hidden />
            Patterns across devices
          </h2>
          <span className="text-xs text-graphite-500">Each device counts once, judged on its latest teardown you can read.</span>
        </summary>
        <WidgetBoundary name="patterns">
          <Patterns />
        </WidgetBoundary>
      </details>

      <div className="grid gap-6 lg:grid-cols-[14rem_minmax(0,1fr)]">
        <aside className="lg:sticky lg:top-4 lg:max-h-[calc(100vh-2rem)] lg:self-start lg:overflow-y-auto lg:pr-1">
          <h2 className="sr-only">Facets</h2>
          <FacetPanel state={state} data={data} onChange={update} />
        </aside>

        <div className="min-w-0 space-y-3">
          <div className="flex flex-wrap items-start gap-2">
            <SearchBox value={state.q} onCommit={(q, { replace }) => setState(changeSearch(state, { q, sort: q ? state.sort : state.sort === 'relevance' ? null : state.sort }), { replace })} />
            <label className="sr-only" htmlFor="explorer-sort">
              Sort by
            </label>
            <select
              id="explorer-sort"
              value={sort}
              onChange={(e) => setSort(e.target.value as SearchSort)}
              className="h-10 rounded-md border border-graphite-200 bg-white pr-8 pl-3 text-sm focus:border-copper-500 focus:ring-2 focus:ring-copper-200 focus:outline-none"
            >
              {SEARCH_SORT.values
                .filter((v) => v !== 'relevance' || state.q)
                .map((v) => (
                  <option key={v} value={v}>
                    Sort: {SEARCH_SORT.labels[v]}
                  </option>
                ))}
            </select>
            <Button
              variant="secondary"
              className="h-10"
              onClick={() => setSort(sort, dir === 'asc' ? 'desc' : 'asc')}
              aria-label={`Reverse the order (now ${dir === 'asc' ? 'ascending' : 'descending'})`}
              title="Reverse the order"
            >
              <ArrowDownUp className="size-4" aria-hidden />
            </Button>
            <a href={searchCsvUrl(state)} download className="inline-flex">
              <Button variant="secondary" className="h-10" tabIndex={-1} disabled={!data || data.total === 0}>
                <Download className="size-4" aria-hidden /> Export CSV
              </Button>
            </a>
          </div>

          <ActiveFilters state={state} deviceNames={deviceNames} onChange={update} />

          {invertedDates ? (
            <div role="alert" className="flex flex-wrap items-center justify-between gap-3 rounded-lg border border-amber-100 bg-amber-50 px-4 py-3 text-sm text-amber-800">
              <span>The date range ends before it starts: change the From or To date under Teardown date.</span>
              <Button size="sm" variant="secondary" onClick={() => update(changeSearch(state, { from: null, to: null }))}>
                Clear the dates
              </Button>
            </div>
          ) : results.isPending ? (
            <Spinner label="Searching…" />
          ) : results.isError ? (
            <ErrorPanel error={results.error} onRetry={() => results.refetch()} />
          ) : (
            <>
              <p className="text-sm text-graphite-600" aria-live="polite">
                <span className="num font-medium text-graphite-900">{data!.total}</span>{' '}
                {data!.mode === 'search' ? (
                  <>
                    {data!.total === 1 ? 'hit' : 'hits'} for <span className="font-medium text-graphite-900">{data!.terms.join(' ')}</span>
                  </>
                ) : data!.types.length === 1 && data!.types[0] === 'finding' ? (
                  data!.total === 1 ? (
                    'finding'
                  ) : (
                    'findings'
                  )
                ) : data!.total === 1 ? (
                  'record'
                ) : (
                  'records'
                )}
                {data!.mode === 'browse' && data!.types.length === 1 && data!.types[0] === 'finding' && state.type.length === 0 && ' (without search words the explorer lists findings)'}
              </p>
              {data!.total === 0 ? (
                <div className="rounded-lg border border-graphite-150 bg-white">
                  <EmptyState
                    icon={<SearchX className="size-8" />}
                    message={
                      data!.mode === 'search'
                        ? 'Nothing matches these words with these filters. Remove a filter or try fewer, shorter words.'
                        : 'Nothing matches these filters. Remove one, or record findings in a teardown’s Findings section.'
                    }
                    action={
                      <Button
                        variant="secondary"
                        onClick={() => update({ ...state, type: [], kind: [], severity: [], category: [], maker: [], tag: [], status: [], device: [], from: null, to: null, page: 1 })}
                      >
                        Clear filters
                      </Button>
                    }
                  />
                </div>
              ) : (
                <ResultsTable items={data!.items} sort={sort} dir={dir} onSort={setSort} busy={results.isPlaceholderData} />
              )}
              <Pager page={state.page} pageSize={SEARCH_PAGE_SIZE} total={data!.total} onPage={(page) => update(changeSearch(state, { page }))} />
            </>
          )}
        </div>
      </div>
    </>
  );
}

function Patterns() {
  const patterns = usePatterns();
  if (patterns.isPending) return <Spinner label="Counting patterns…" />;
  if (patterns.isError) return <ErrorPanel error={patterns.error} onRetry={() => patterns.refetch()} />;
  return (
    <div className="space-y-2">
      <PatternCards patterns={patterns.data.patterns} />
      <EstimatesNote text={patterns.data.note} />
    </div>
  );
}
