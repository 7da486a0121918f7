// Findings explorer: full-text search with facets across teardowns, the URL that holds a search,
// and pattern counts across devices.
import { z } from 'zod';
import { safeString } from './common';
import { DEVICE_CATEGORY, FINDING_KIND, SEVERITY, TEARDOWN_STATUS, type DeviceCategory, type FindingKind, type Severity, type TeardownStatus } from './domain';

const labelled = <const T extends readonly string[]>(values: T, labels: Record<T[number], string>) => ({ values, labels, schema: z.enum(values) });

/** What a search hit can be. */
export const SEARCH_TYPE = labelled(['finding', 'part', 'teardown', 'comment'] as const, {
  finding: 'Finding',
  part: 'Part',
  teardown: 'Teardown summary',
  comment: 'Comment',
});
export type SearchType = (typeof SEARCH_TYPE.values)[number];

/** The section of the teardown workspace that holds each kind of hit. */
export const SEARCH_SECTION = { finding: 'findings', part: 'parts', teardown: 'overview', comment: 'comments' } as const satisfies Record<SearchType, string>;
export type SearchSection = (typeof SEARCH_SECTION)[SearchType];

export const SEARCH_SORT = labelled(['relevance', 'date', 'severity', 'device', 'type', 'kind', 'status', 'title'] as const, {
  relevance: 'Best match',
  date: 'Teardown date',
  severity: 'Severity',
  device: 'Device',
  type: 'Type',
  kind: 'Kind',
  status: 'Teardown status',
  title: 'Title',
});
export type SearchSort = (typeof SEARCH_SORT.values)[number];
export type SortDir = 'asc' | 'desc';
/**
 * The direction each sort starts in: best match first, newest teardown first, most severe first,
 * the rest A→Z. `dir` reverses it.
 */
export const SEARCH_SORT_DIR: Record<SearchSort, SortDir> = {
  relevance: 'desc',
  date: 'desc',
  severity: 'desc',
  device: 'asc',
  type: 'asc',
  kind: 'asc',
  status: 'asc',
  title: 'asc',
};

/** Facets counted by the search, in the order the explorer shows them. */
export const SEARCH_FACETS = ['type', 'kind', 'severity', 'category', 'maker', 'tag', 'status'] as const;
export type SearchFacet = (typeof SEARCH_FACETS)[number];

export const MAX_SEARCH_TERMS = 12;
export const MAX_SEARCH_PAGE_SIZE = 200;
export const SEARCH_PAGE_SIZE = 50;

/**
 * The words of a search box: runs of letters, digits and marks (what the index tokenises); every
 * other character (quotes, brackets, `*`, `-`, `:`…) only separates words. Search operators typed
 * by a user are words like any other. At most MAX_SEARCH_TERMS words.
 */
export function searchTerms(q: string | null | undefined): string[] {
  return (
    (q ?? '')
      .normalize('NFC')
      .match(/[\p{L}\p{N}\p{M}\p{Co}]+/gu)
      ?.slice(0, MAX_SEARCH_TERMS) ?? []
  );
}

// ── Snippets ───────────────────────────────────────────────────────────────────────────────────
/** A snippet marks each hit between these two control characters; stored text never contains them. */
export const SNIPPET_HIT_START = '\u0002';
export const SNIPPET_HIT_END = '\u0003';

/** Split a snippet into plain runs and hits, for rendering as text (never as HTML). */
export function snippetParts(snippet: string): { text: string; hit: boolean }[] {
  const parts: { text: string; hit: boolean }[] = [];
  let hit = false;
  let run = '';
  for (const ch of snippet) {
    if (ch === SNIPPET_HIT_START || ch === SNIPPET_HIT_END) {
      if (run) parts.push({ text: run, hit });
      run = '';
      hit = ch === SNIPPET_HIT_START;
    } else run += ch;
  }
  if (run) parts.push({ text: run, hit });
  return parts;
}

/** The snippet without hit markers (CSV, titles). */
export const snippetText = (snippet: string) => snippet.replaceAll(SNIPPET_HIT_START, '').replaceAll(SNIPPET_HIT_END, '');

// ── GET /api/search ────────────────────────────────────────────────────────────────────────────
/** A query parameter that may be repeated (`kind=safety&kind=compliance`): always a list. */
const many = <T extends z.ZodType>(item: T, name: string, max = 50) =>
  z.preprocess(
    (v) => (v === undefined || v === '' ? [] : Array.isArray(v) ? v.filter((x) => x !== '') : [v]),
    z.array(item, { error: `Give ${name} as one or more values` }).max(max, `At most ${max} ${name} values`),
  );

const isoDate = z.preprocess(
  (v) => (v === '' ? undefined : v),
  safeString({ error: 'Use a date as YYYY-MM-DD' })
    .trim()
    .regex(/^\d{4}-\d{2}-\d{2}$/, 'Use a date as YYYY-MM-DD')
    .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s), 'Not a calendar date')
    .optional(),
);

const wholeNumber = (min: number, max: number, fallback: number) =>
  z.preprocess(
    (v) => (v === undefined || v === '' ? fallback : v),
    z.coerce.number({ error: 'Give a whole number' }).int('Give a whole number').min(min, `At least ${min}`).max(max, `At most ${max}`),
  );

/**
 * Query of GET /api/search and GET /api/search.csv. Every facet may be repeated: values of one facet
 * are alternatives (OR), different facets all apply (AND), and all combine with `q`. Without `q`
 * and without `type` the explorer lists findings (browse mode). `kind`, `severity` and `tag` are
 * finding fields: giving one keeps findings only. `from`/`to` bound the teardown date (inclusive).
 */
export const searchQuery = z
  .object({
    q: safeString().trim().max(200, 'At most 200 characters').optional(),
    type: many(SEARCH_TYPE.schema, 'type'),
    kind: many(FINDING_KIND.schema, 'kind'),
    severity: many(SEVERITY.schema, 'severity'),
    category: many(DEVICE_CATEGORY.schema, 'category'),
    maker: many(safeString().trim().min(1, 'A maker cannot be empty').max(120, 'At most 120 characters'), 'maker'),
    tag: many(safeString().trim().toLowerCase().min(1, 'A tag cannot be empty').max(40, 'A tag has at most 40 characters'), 'tag'),
    status: many(TEARDOWN_STATUS.schema, 'status'),
    device: many(z.coerce.number({ error: 'Give device ids as numbers' }).int('Give device ids as whole numbers').positive('Give device ids as positive numbers'), 'device', 200),
    from: isoDate,
    to: isoDate,
    sort: SEARCH_SORT.schema.optional(),
    dir: z.enum(['asc', 'desc']).optional(),
    limit: wholeNumber(1, MAX_SEARCH_PAGE_SIZE, SEARCH_PAGE_SIZE),
    offset: wholeNumber(0, 1_000_000, 0),
  })
  .superRefine((v, ctx) => {
    if (v.q && searchTerms(v.q).length === 0) ctx.addIssue({ code: 'custom', path: ['q'], message: 'Type at least one letter or digit to search' });
    if (v.from && v.to && v.from > v.to) ctx.addIssue({ code: 'custom', path: ['to'], message: 'The end date is before the start date' });
  });
export type SearchQuery = z.output<typeof searchQuery>;

export const searchItemSchema = z.object({
  type: SEARCH_TYPE.schema,
  id: z.number().int(),
  teardownId: z.number().int(),
  deviceId: z.number().int(),
  title: safeString(),
  /** Plain text; hits between SNIPPET_HIT_START and SNIPPET_HIT_END (render with snippetParts). */
  snippet: safeString(),
  section: z.enum(['findings', 'parts', 'overview', 'comments']),
  device: z.object({ maker: safeString(), model: safeString(), category: DEVICE_CATEGORY.schema }),
  teardown: z.object({ status: TEARDOWN_STATUS.schema, date: safeString(), unitLabel: safeString().nullable() }),
  /** Finding fields (null/empty for other types). */
  kind: FINDING_KIND.schema.nullable(),
  severity: SEVERITY.schema.nullable(),
  tags: z.array(safeString()),
  createdAt: safeString(),
});
export type SearchItem = z.infer<typeof searchItemSchema>;

const counts = z.record(safeString(), z.number().int());
export const searchFacetsSchema = z.object({
  type: counts,
  kind: counts,
  severity: counts,
  category: counts,
  maker: counts,
  tag: counts,
  status: counts,
  /** Hits by month of the teardown date (YYYY-MM), for the date range. */
  month: counts,
});
export type SearchFacets = z.infer<typeof searchFacetsSchema>;

export const searchResponse = z.object({
  total: z.number().int(),
  items: z.array(searchItemSchema),
  /**
   * Counts over the current results. Each facet is counted with every filter applied except its
   * own, so a facet lists the alternatives a user can add (OR) with how many hits each brings.
   */
  facets: searchFacetsSchema,
  /** 'search' with words to match, 'browse' without (findings by default). */
  mode: z.enum(['search', 'browse']),
  terms: z.array(safeString()),
  /** The types listed (browse mode without a type filter: findings). */
  types: z.array(SEARCH_TYPE.schema),
  sort: SEARCH_SORT.schema,
  dir: z.enum(['asc', 'desc']),
  limit: z.number().int(),
  offset: z.number().int(),
});
export type SearchResponse = z.infer<typeof searchResponse>;

// ── The URL of the explorer ────────────────────────────────────────────────────────────────────
/** Everything the explorer's URL holds. Lists keep the order the user chose; empty means "any". */
export interface SearchState {
  q: string;
  type: SearchType[];
  kind: FindingKind[];
  severity: Severity[];
  category: DeviceCategory[];
  maker: string[];
  tag: string[];
  status: TeardownStatus[];
  device: number[];
  from: string | null;
  to: string | null;
  sort: SearchSort | null;
  dir: SortDir | null;
  /** 1-based page. */
  page: number;
}

export const EMPTY_SEARCH: SearchState = {
  q: '',
  type: [],
  kind: [],
  severity: [],
  category: [],
  maker: [],
  tag: [],
  status: [],
  device: [],
  from: null,
  to: null,
  sort: null,
  dir: null,
  page: 1,
};

const LIST_KEYS = ['type', 'kind', 'severity', 'category', 'maker', 'tag', 'status', 'device'] as const;
const ALLOWED: { [K in (typeof LIST_KEYS)[number]]: (v: string) => SearchState[K][number] | undefined } = {
  type: (v) => SEARCH_TYPE.schema.safeParse(v).data,
  kind: (v) => FINDING_KIND.schema.safeParse(v).data,
  severity: (v) => SEVERITY.schema.safeParse(v).data,
  category: (v) => DEVICE_CATEGORY.schema.safeParse(v).data,
  maker: (v) => (v.trim() ? v.trim().slice(0, 120) : undefined),
  tag: (v) => (v.trim() ? v.trim().toLowerCase().slice(0, 40) : undefined),
  status: (v) => TEARDOWN_STATUS.schema.safeParse(v).data,
  device: (v) => (/^[1-9]\d{0,9}$/.test(v) ? Number(v) : undefined),
};
const DATE = /^\d{4}-\d{2}-\d{2}$/;

/** What reading a query needs (URLSearchParams has it). */
export interface QueryParamsLike {
  get(name: string): string | null;
  getAll(name: string): string[];
}

type Pairs = [string, string][];
const toQuery = (pairs: Pairs) => pairs.map(([k, v]) => `${encodeURIComponent(k)}=${encodeURIComponent(v)}`).join('&');

function writeCommon(s: SearchState): Pairs {
  const p: Pairs = [];
  if (s.q.trim()) p.push(['q', s.q.trim()]);
  for (const key of LIST_KEYS) for (const v of new Set<string | number>(s[key])) p.push([key, String(v)]);
  if (s.from) p.push(['from', s.from]);
  if (s.to) p.push(['to', s.to]);
  if (s.sort) p.push(['sort', s.sort]);
  return p;
}

/** The query string (without "?") of the explorer's URL for a state; defaults are left out, so equal states give equal URLs. */
export function searchStateToQuery(s: SearchState): string {
  const p = writeCommon(s);
  if (s.sort && s.dir && s.dir !== SEARCH_SORT_DIR[s.sort]) p.push(['dir', s.dir]);
  if (s.page > 1) p.push(['page', String(s.page)]);
  return toQuery(p);
}

/** The query string of GET /api/search (and search.csv) for a state: the same parameters, the page as limit/offset. */
export function searchApiQuery(s: SearchState, pageSize = SEARCH_PAGE_SIZE): string {
  const p = writeCommon(s);
  if (s.sort) p.push(['dir', s.dir ?? SEARCH_SORT_DIR[s.sort]]);
  p.push(['limit', String(pageSize)]);
  if (s.page > 1) p.push(['offset', String((s.page - 1) * pageSize)]);
  return toQuery(p);
}

/** Read the explorer's URL (e.g. `new URLSearchParams(location.search)`); anything not understood is left out rather than refused. */
export function searchStateFromParams(p: QueryParamsLike): SearchState {
  const s: SearchState = { ...EMPTY_SEARCH };
  s.q = (p.get('q') ?? '').trim().slice(0, 200);
  for (const key of LIST_KEYS) {
    const values = p
      .getAll(key)
      .map((v: string) => ALLOWED[key](v))
      .filter((v) => v !== undefined);
    (s as unknown as Record<string, unknown[]>)[key] = [...new Set(values)];
  }
  const from = p.get('from');
  const to = p.get('to');
  s.from = from && DATE.test(from) ? from : null;
  s.to = to && DATE.test(to) ? to : null;
  const sort = SEARCH_SORT.schema.safeParse(p.get('sort')).data;
  s.sort = sort ?? null;
  const dir = p.get('dir');
  s.dir = sort ? (dir === 'asc' || dir === 'desc' ? dir : SEARCH_SORT_DIR[sort]) : null;
  const page = Number(p.get('page'));
  s.page = Number.isInteger(page) && page > 1 && page < 100_000 ? page : 1;
  return s;
}

// ── GET /api/patterns ──────────────────────────────────────────────────────────────────────────
export const patternDeviceSchema = z.object({
  id: z.number().int(),
  maker: safeString(),
  model: safeString(),
  category: DEVICE_CATEGORY.schema,
  /** The teardown the device was judged on (its latest one the caller may read). */
  teardownId: z.number().int(),
});
export type PatternDevice = z.infer<typeof patternDeviceSchema>;

export const patternSchema = z.object({
  key: safeString(),
  /** The sentence with its numbers, e.g. "1 of 3 pocket heaters has no temperature sensor". */
  label: safeString(),
  /** A short heading without numbers. */
  title: safeString(),
  /** Devices that show the pattern. */
  count: z.number().int(),
  /** Devices of the group that have the data to judge it. */
  of: z.number().int(),
  deviceIds: z.array(z.number().int()),
  /** The devices behind `count`. */
  devices: z.array(patternDeviceSchema),
  /** How it is judged, in one sentence. */
  basis: safeString(),
  /** A safety pattern (its card shows the caution tone). */
  safety: z.boolean(),
});
export type Pattern = z.infer<typeof patternSchema>;

export const patternsResponse = z.object({ patterns: z.array(patternSchema), note: safeString() });
export type PatternsResponse = z.infer<typeof patternsResponse>;
