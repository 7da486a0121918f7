// The explorer's URL round trip: the query string written for a search state reads back as the same
// state, and the API query made from it parses (with the API's own schema) to the same filters.
import { describe, expect, it } from 'vitest';
import { EMPTY_SEARCH, SNIPPET_HIT_END, SNIPPET_HIT_START, searchApiQuery, searchQuery, searchStateToQuery, searchTerms, snippetParts, snippetText, type SearchState } from '@splitcase/contracts';
import { changeSearch, readSearchState, searchHref, toggleValue } from './search-url';

/** What Express's query parser makes of a query string: a repeated key becomes a list. */
function expressQuery(qs: string): Record<string, string | string[]> {
  const out: Record<string, string | string[]> = {};
  for (const [k, v] of new URLSearchParams(qs)) {
    const prev = out[k];
    out[k] = prev === undefined ? v : Array.isArray(prev) ? [...prev, v] : [prev, v];
  }
  return out;
}

const STATES: SearchState[] = [
  EMPTY_SEARCH,
  { ...EMPTY_SEARCH, q: 'sensor' },
  {
    ...EMPTY_SEARCH,
    q: 'no "temperature" sensor (NEAR) -pwm*',
    type: ['finding', 'comment'],
    kind: ['safety', 'compliance'],
    severity: ['critical', 'major'],
    category: ['pocket-heater'],
    maker: ['Halvix', 'Pellam Works', 'A&B = C #1, Ltd.'],
    tag: ['label-claim', 'usb-c'],
    status: ['published', 'in_review'],
    device: [3, 12],
    from: '2026-06-01',
    to: '2026-10-31',
    sort: 'severity',
    dir: 'asc',
    page: 3,
  },
  { ...EMPTY_SEARCH, q: 'Ω µH naïve 18650', sort: 'date', dir: 'desc', page: 2 },
];

describe('explorer URL', () => {
  it.each(STATES.map((s, i) => [i, s] as const))('state %i reads back from its URL unchanged, and writes the same URL again', (_i, state) => {
    const qs = searchStateToQuery(state);
    const back = readSearchState(qs);
    expect(back).toEqual(state);
    expect(searchStateToQuery(back)).toBe(qs);
    expect(readSearchState(`?${qs}`)).toEqual(state);
  });

  it('the API query of a state parses, with the API schema, to the same filters and the page as an offset', () => {
    const state = STATES[2]!;
    const parsed = searchQuery.parse(expressQuery(searchApiQuery(state, 25)));
    expect(parsed).toEqual({
      q: state.q,
      type: state.type,
      kind: state.kind,
      severity: state.severity,
      category: state.category,
      maker: state.maker,
      tag: state.tag,
      status: state.status,
      device: state.device,
      from: state.from,
      to: state.to,
      sort: 'severity',
      dir: 'asc',
      limit: 25,
      offset: 50,
    });
    // A single value is a list of one, as the API reads it.
    expect(searchQuery.parse(expressQuery(searchApiQuery({ ...EMPTY_SEARCH, kind: ['safety'] })))).toMatchObject({ kind: ['safety'], limit: 50, offset: 0 });
  });

  it('defaults stay out of the URL: the empty search is the bare page, the default direction of a sort is not written', () => {
    expect(searchStateToQuery(EMPTY_SEARCH)).toBe('');
    expect(searchHref({})).toBe('/findings');
    expect(searchStateToQuery({ ...EMPTY_SEARCH, sort: 'date', dir: 'desc' })).toBe('sort=date');
    expect(searchStateToQuery({ ...EMPTY_SEARCH, sort: 'date', dir: 'asc' })).toBe('sort=date&dir=asc');
    expect(searchHref({ device: [4, 9] })).toBe('/findings?device=4&device=9');
  });

  it('a hand-edited URL is read leniently: unknown values, bad dates and pages are dropped', () => {
    const s = readSearchState('kind=safety&kind=bogus&severity=MAJOR&from=2026-13&to=2026-11-30&page=-2&device=x&device=7&sort=nope&dir=asc&tag=Thermal');
    expect(s).toEqual({ ...EMPTY_SEARCH, kind: ['safety'], to: '2026-11-30', device: [7], tag: ['thermal'] });
  });

  it('a change goes back to page 1; a value toggles in and out of a facet', () => {
    const s = { ...EMPTY_SEARCH, q: 'cell', page: 4 };
    expect(changeSearch(s, { kind: ['safety'] }).page).toBe(1);
    expect(changeSearch(s, { page: 5 }).page).toBe(5);
    expect(toggleValue(['a', 'b'], 'a')).toEqual(['b']);
    expect(toggleValue(['a'], 'b')).toEqual(['a', 'b']);
  });
});

describe('search words and snippets', () => {
  it('only letters, digits and marks make words; operators and punctuation separate them', () => {
    expect(searchTerms('no "temperature" sensor (NEAR) -pwm* AND/OR')).toEqual(['no', 'temperature', 'sensor', 'NEAR', 'pwm', 'AND', 'OR']);
    expect(searchTerms('***"()-')).toEqual([]);
    expect(searchTerms('li-ion 3.7V')).toEqual(['li', 'ion', '3', '7V']);
    expect(searchTerms('a b c d e f g h i j k l m n')).toHaveLength(12);
  });

  it('a snippet splits into plain runs and hits, and loses its markers as text', () => {
    const s = `No temperature ${SNIPPET_HIT_START}sensor${SNIPPET_HIT_END} anywhere <b>`;
    expect(snippetParts(s)).toEqual([
      { text: 'No temperature ', hit: false },
      { text: 'sensor', hit: true },
      { text: ' anywhere <b>', hit: false },
    ]);
    expect(snippetText(s)).toBe('No temperature sensor anywhere <b>');
  });
});
