import { useEffect, useRef, useState } from 'react';
import { Search, X } from 'lucide-react';
import { searchTerms } from '@splitcase/contracts';
import { useDebouncedValue } from '@/lib/use-debounced-value';

/**
 * The search words. Typing commits after a pause (replacing the current history entry, so back does
 * not step through every letter); Enter commits at once as a new entry. When the URL's words change
 * from outside (back/forward, a link), the box follows.
 */
export function SearchBox({ value, onCommit }: { value: string; onCommit: (q: string, options: { replace: boolean }) => void }) {
  const [input, setInput] = useState(value);
  const committed = useRef(value);
  const debounced = useDebouncedValue(input, 300);
  const terms = searchTerms(input);
  const nothingToSearch = input.trim() !== '' && terms.length === 0;

  // The URL changed under us (back/forward, a pattern link): show its words.
  useEffect(() => {
    if (value !== committed.current) {
      committed.current = value;
      setInput(value);
    }
  }, [value]);

  const commit = (q: string, replace: boolean) => {
    const next = q.trim();
    if (next === committed.current.trim()) return;
    if (next !== '' && searchTerms(next).length === 0) return;
    committed.current = next;
    onCommit(next, { replace });
  };

  useEffect(() => {
    commit(debounced, true);
    // Only a settled value commits (commit reads the latest refs).
  }, [debounced]);

  return (
    <div className="min-w-0 flex-1">
      <form
        role="search"
        onSubmit={(e) => {
          e.preventDefault();
          commit(input, false);
        }}
        className="relative"
      >
        <label htmlFor="explorer-q" className="sr-only">
          Search findings, parts, teardown summaries and comments
        </label>
        <Search className="pointer-events-none absolute top-1/2 left-3 size-4 -translate-y-1/2 text-graphite-400" aria-hidden />
        <input
          id="explorer-q"
          type="search"
          value={input}
          onChange={(e) => setInput(e.target.value)}
          placeholder="Search: sensor, soldered cell, 18650, swollen…"
          autoComplete="off"
          aria-invalid={nothingToSearch}
          aria-describedby="explorer-q-hint"
          className="block h-10 w-full rounded-md border border-graphite-200 bg-white pr-9 pl-9 text-sm text-graphite-950 placeholder:text-graphite-400 focus:border-copper-500 focus:ring-2 focus:ring-copper-200 focus:outline-none aria-[invalid=true]:border-amber-600 [&::-webkit-search-cancel-button]:hidden"
        />
        {input && (
          <button
            type="button"
            aria-label="Clear the search words"
            onClick={() => {
              setInput('');
              commit('', false);
            }}
            className="absolute top-1/2 right-2 -translate-y-1/2 rounded p-1 text-graphite-400 hover:bg-graphite-100 hover:text-graphite-700"
          >
            <X className="size-4" aria-hidden />
          </button>
        )}
      </form>
      <p id="explorer-q-hint" className={`mt-1 text-xs ${nothingToSearch ? 'text-amber-800' : 'text-graphite-500'}`}>
        {nothingToSearch
          ? 'Type at least one letter or digit: punctuation and operators only separate words.'
          : 'Every word must match; a word also finds longer ones ("sens" finds sensor). Without words, the findings are listed.'}
      </p>
    </div>
  );
}
